import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from "typeorm";
import type { ShareItemType, ShareKind } from "@shared/schemas/shares";
import { Lab } from "./Lab";
import { User } from "./User";

/**
 * One lab item opened read-only outside the lab: by a secret link (`tokenSha256`) or to a
 * guest's e-mail address (`email`). Exactly one of the item columns is set, per `itemType`.
 */
@Entity({ name: "shares" })
export class Share {
  @PrimaryGeneratedColumn("uuid")
  id: string;

  @Column({ type: "uuid", name: "lab_id" })
  labId: string;

  @ManyToOne(() => Lab, { onDelete: "CASCADE" })
  @JoinColumn({ name: "lab_id" })
  lab?: Lab;

  @Column({ type: "text" })
  kind: ShareKind;

  @Column({ type: "text", name: "item_type" })
  itemType: ShareItemType;

  @Column({ type: "uuid", name: "session_id", nullable: true })
  sessionId: string | null;

  @Column({ type: "uuid", name: "run_id", nullable: true })
  runId: string | null;

  @Column({ type: "uuid", name: "reconstruction_id", nullable: true })
  reconstructionId: string | null;

  /** SHA-256 (hex) of the link's secret; the secret itself is never stored. */
  @Column({ type: "text", name: "token_sha256", nullable: true })
  tokenSha256: string | null;

  /** The guest's address, lower-cased. */
  @Column({ type: "text", nullable: true })
  email: string | null;

  @Column({ type: "text", default: "" })
  label: string;

  @Column({ type: "timestamptz", name: "expires_at", nullable: true })
  expiresAt: Date | null;

  @Column({ type: "timestamptz", name: "revoked_at", nullable: true })
  revokedAt: Date | null;

  @Column({ type: "uuid", name: "revoked_by_id", nullable: true })
  revokedById: string | null;

  @ManyToOne(() => User, { onDelete: "SET NULL" })
  @JoinColumn({ name: "revoked_by_id" })
  revokedBy?: User | null;

  @Column({ type: "integer", name: "open_count", default: 0 })
  openCount: number;

  @Column({ type: "timestamptz", name: "last_opened_at", nullable: true })
  lastOpenedAt: Date | null;

  @Column({ type: "uuid", name: "created_by_id", nullable: true })
  createdById: string | null;

  @ManyToOne(() => User, { onDelete: "SET NULL" })
  @JoinColumn({ name: "created_by_id" })
  createdBy?: User | null;

  @CreateDateColumn({ type: "timestamptz", name: "created_at" })
  createdAt: Date;
}
