import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from "typeorm";
import type { LabRole } from "@shared/schemas/roles";
import { Lab } from "./Lab";
import { User } from "./User";

/** An e-mailed invitation into a lab with a role: single-use, expiring, revocable. */
@Entity({ name: "invitations" })
export class Invitation {
  @PrimaryGeneratedColumn("uuid")
  id: string;

  @Column({ type: "uuid", name: "lab_id" })
  labId: string;

  /** Stored lower-cased. */
  @Column({ type: "text" })
  email: string;

  @Column({ type: "text" })
  role: LabRole;

  @Column({ type: "text", name: "token_sha256" })
  tokenSha256: string;

  @Column({ type: "uuid", name: "invited_by_id", nullable: true })
  invitedById: string | null;

  @CreateDateColumn({ type: "timestamptz", name: "created_at" })
  createdAt: Date;

  @Column({ type: "timestamptz", name: "expires_at" })
  expiresAt: Date;

  @Column({ type: "timestamptz", name: "accepted_at", nullable: true })
  acceptedAt: Date | null;

  @Column({ type: "uuid", name: "accepted_by_id", nullable: true })
  acceptedById: string | null;

  @Column({ type: "timestamptz", name: "revoked_at", nullable: true })
  revokedAt: Date | null;

  @ManyToOne(() => Lab, { onDelete: "CASCADE" })
  @JoinColumn({ name: "lab_id" })
  lab?: Lab;

  @ManyToOne(() => User, { onDelete: "SET NULL" })
  @JoinColumn({ name: "invited_by_id" })
  invitedBy?: User | null;
}
