import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from "typeorm";

@Entity({ name: "users" })
export class User {
  @PrimaryGeneratedColumn("uuid")
  id: string;

  /** Stored lower-cased; unique. */
  @Column({ type: "text", unique: true })
  email: string;

  @Column({ type: "text", name: "display_name" })
  displayName: string;

  @Column({ type: "text", name: "password_hash" })
  passwordHash: string;

  @Column({ type: "timestamptz", name: "email_verified_at", nullable: true })
  emailVerifiedAt: Date | null;

  @CreateDateColumn({ type: "timestamptz", name: "created_at" })
  createdAt: Date;
}
