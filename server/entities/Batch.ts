import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from "typeorm";
import { LabSession } from "./LabSession";
import { User } from "./User";

/** One batch upload into a lab session; its files are BatchFile rows. Counts are derived from them. */
@Entity({ name: "batches" })
export class Batch {
  @PrimaryGeneratedColumn("uuid")
  id: string;

  @Column({ type: "uuid", name: "lab_id" })
  labId: string;

  @Column({ type: "uuid", name: "session_id" })
  sessionId: string;

  @ManyToOne(() => LabSession, { onDelete: "CASCADE" })
  @JoinColumn({ name: "session_id" })
  session?: LabSession;

  /** "browser": a signed-in upload; "token": the CLI or an acquisition script with an API token. */
  @Column({ type: "text" })
  origin: "browser" | "token";

  @Column({ type: "uuid", name: "token_id", nullable: true })
  tokenId: string | null;

  @Column({ type: "integer", name: "file_count" })
  fileCount: number;

  @Column({ type: "uuid", name: "created_by_id", nullable: true })
  createdById: string | null;

  @ManyToOne(() => User, { onDelete: "SET NULL" })
  @JoinColumn({ name: "created_by_id" })
  createdBy?: User | null;

  @CreateDateColumn({ type: "timestamptz", name: "created_at" })
  createdAt: Date;
}
