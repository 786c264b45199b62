import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from "typeorm";
import type { z } from "zod";
import type { CountsRowDto, RowChangeSchema } from "@shared/schemas/runs";
import { Run } from "./Run";
import { User } from "./User";

export type RowChange = z.infer<typeof RowChangeSchema>;

/**
 * The raw counts of a run, exactly as entered (number 1) or as corrected later (2, 3, …).
 * Never updated: a database trigger refuses it.
 */
@Entity({ name: "run_revisions" })
export class RunRevision {
  @PrimaryGeneratedColumn("uuid")
  id: string;

  @Column({ type: "uuid", name: "lab_id" })
  labId: string;

  @Column({ type: "uuid", name: "run_id" })
  runId: string;

  @ManyToOne(() => Run, { onDelete: "CASCADE" })
  @JoinColumn({ name: "run_id" })
  run?: Run;

  @Column({ type: "integer" })
  number: number;

  @Column({ type: "jsonb" })
  rows: CountsRowDto[];

  @Column({ type: "integer", name: "row_count" })
  rowCount: number;

  @Column({ type: "double precision", name: "total_counts" })
  totalCounts: number;

  @Column({ type: "text", default: "" })
  reason: string;

  @Column({ type: "jsonb", default: () => "'[]'" })
  changes: RowChange[];

  @Column({ type: "uuid", name: "created_by_id", nullable: true })
  createdById: string | null;

  @ManyToOne(() => User, { onDelete: "SET NULL" })
  @JoinColumn({ name: "created_by_id" })
  createdBy?: User | null;

  @CreateDateColumn({ type: "timestamptz", name: "created_at" })
  createdAt: Date;
}
