import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from "typeorm";

export type EmailTokenPurpose = "verify-email" | "reset-password";

/** A one-time link sent by e-mail; only the SHA-256 of its secret is kept. */
@Entity({ name: "email_tokens" })
export class EmailToken {
  @PrimaryGeneratedColumn("uuid")
  id: string;

  @Column({ type: "uuid", name: "user_id" })
  userId: string;

  @Column({ type: "text" })
  purpose: EmailTokenPurpose;

  @Column({ type: "text", name: "token_sha256" })
  tokenSha256: string;

  @CreateDateColumn({ type: "timestamptz", name: "created_at" })
  createdAt: Date;

  @Column({ type: "timestamptz", name: "expires_at" })
  expiresAt: Date;

  @Column({ type: "timestamptz", name: "used_at", nullable: true })
  usedAt: Date | null;
}
