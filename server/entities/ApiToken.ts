import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from "typeorm";
import { Lab } from "./Lab";
import { User } from "./User";

/**
 * A personal API token. Only the SHA-256 of the secret is kept (see services/apiTokens.ts for
 * why a fast hash is right here); `hint` is its first characters, for recognising it.
 */
@Entity({ name: "api_tokens" })
export class ApiToken {
  @PrimaryGeneratedColumn("uuid")
  id: string;

  @Column({ type: "uuid", name: "user_id" })
  userId: string;

  @Column({ type: "uuid", name: "lab_id" })
  labId: string;

  @Column({ type: "text" })
  name: string;

  @Column({ type: "text", name: "secret_sha256", unique: true })
  secretSha256: string;

  @Column({ type: "text" })
  hint: string;

  @CreateDateColumn({ type: "timestamptz", name: "created_at" })
  createdAt: Date;

  @Column({ type: "timestamptz", name: "last_used_at", nullable: true })
  lastUsedAt: Date | null;

  @Column({ type: "timestamptz", name: "expires_at", nullable: true })
  expiresAt: Date | null;

  @Column({ type: "timestamptz", name: "revoked_at", nullable: true })
  revokedAt: Date | null;

  @ManyToOne(() => User, { onDelete: "CASCADE" })
  @JoinColumn({ name: "user_id" })
  user?: User;

  @ManyToOne(() => Lab, { onDelete: "CASCADE" })
  @JoinColumn({ name: "lab_id" })
  lab?: Lab;
}
