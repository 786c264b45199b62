import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from "typeorm";
import type { BatchFileFormat, BatchFileStatus } from "@shared/schemas/batches";
import type { FileIssue } from "@shared/formats/runJson";
import { Batch } from "./Batch";
import { Run } from "./Run";

/**
 * One unit of a batch: an uploaded file, a zip member or a sweep line. Its content (the bytes
 * that define the run) and their SHA-256 are kept, so a job can run again after a crash and a
 * second upload of the same content is recognised.
 */
@Entity({ name: "batch_files" })
export class BatchFile {
  @PrimaryGeneratedColumn("uuid")
  id: string;

  @Column({ type: "uuid", name: "lab_id" })
  labId: string;

  @Column({ type: "uuid", name: "batch_id" })
  batchId: string;

  @ManyToOne(() => Batch, { onDelete: "CASCADE" })
  @JoinColumn({ name: "batch_id" })
  batch?: Batch;

  @Column({ type: "integer" })
  position: number;

  @Column({ type: "text", name: "file_name" })
  fileName: string;

  /** Null for a file refused on arrival (unsupported, too large, damaged archive member). */
  @Column({ type: "text", nullable: true })
  format: BatchFileFormat | null;

  /** Line of a sweep file this run came from. */
  @Column({ type: "integer", name: "source_line", nullable: true })
  sourceLine: number | null;

  @Column({ type: "integer", name: "size_bytes" })
  sizeBytes: number;

  @Column({ type: "text", nullable: true })
  sha256: string | null;

  /** Not loaded by default: progress reads need only the status. */
  @Column({ type: "bytea", nullable: true, select: false })
  content: Buffer | null;

  @Column({ type: "text" })
  status: BatchFileStatus;

  @Column({ type: "text", nullable: true })
  message: string | null;

  @Column({ type: "jsonb", default: () => "'[]'" })
  issues: FileIssue[];

  @Column({ type: "uuid", name: "run_id", nullable: true })
  runId: string | null;

  @ManyToOne(() => Run, { onDelete: "SET NULL" })
  @JoinColumn({ name: "run_id" })
  run?: Run | null;

  @Column({ type: "uuid", name: "duplicate_of_run_id", nullable: true })
  duplicateOfRunId: string | null;

  @ManyToOne(() => Run, { onDelete: "SET NULL" })
  @JoinColumn({ name: "duplicate_of_run_id" })
  duplicateOf?: Run | null;

  @Column({ type: "integer" })
  attempts: number;

  @Column({ type: "timestamptz", name: "started_at", nullable: true })
  startedAt: Date | null;

  @Column({ type: "timestamptz", name: "finished_at", nullable: true })
  finishedAt: Date | null;

  @CreateDateColumn({ type: "timestamptz", name: "created_at" })
  createdAt: Date;
}
