import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from "typeorm";
import { User } from "./User";

/** An uploaded raw file, its bytes kept exactly as they came (never updated). */
@Entity({ name: "attachments" })
export class Attachment {
  @PrimaryGeneratedColumn("uuid")
  id: string;

  @Column({ type: "uuid", name: "lab_id" })
  labId: string;

  @Column({ type: "uuid", name: "run_id" })
  runId: string;

  @Column({ type: "text", name: "file_name" })
  fileName: string;

  @Column({ type: "text", name: "content_type" })
  contentType: string;

  @Column({ type: "integer", name: "size_bytes" })
  sizeBytes: number;

  @Column({ type: "text" })
  sha256: string;

  /** Not loaded by default: lists and run details need only the metadata. */
  @Column({ type: "bytea", select: false })
  content: Buffer;

  @Column({ type: "uuid", name: "created_by_id", nullable: true })
  createdById: string | null;

  @ManyToOne(() => User, { onDelete: "SET NULL" })
  @JoinColumn({ name: "created_by_id" })
  createdBy?: User | null;

  @CreateDateColumn({ type: "timestamptz", name: "created_at" })
  createdAt: Date;
}
