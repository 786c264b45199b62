import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from "typeorm";
import type { z } from "zod";
import type { Corrections, Metrics, ReconstructionMethod, ReconstructionSchema, WarningSchema } from "@shared/schemas/reconstructions";
import { RunRevision } from "./RunRevision";
import { User } from "./User";

type Dto = z.infer<typeof ReconstructionSchema>;

/** One estimator applied to one revision of a run's counts, with its parameters and results. */
@Entity({ name: "reconstructions" })
export class Reconstruction {
  @PrimaryGeneratedColumn("uuid")
  id: string;

  @Column({ type: "uuid", name: "lab_id" })
  labId: string;

  @Column({ type: "uuid", name: "run_id" })
  runId: string;

  @Column({ type: "uuid", name: "revision_id" })
  revisionId: string;

  @ManyToOne(() => RunRevision, { onDelete: "CASCADE" })
  @JoinColumn({ name: "revision_id" })
  revision?: RunRevision;

  @Column({ type: "text" })
  method: ReconstructionMethod;

  @Column({ type: "jsonb" })
  corrections: Corrections;

  @Column({ type: "jsonb" })
  conventions: Dto["conventions"];

  @Column({ type: "jsonb" })
  rho: Dto["rho"];

  @Column({ type: "jsonb" })
  eigenvalues: number[];

  @Column({ type: "boolean" })
  physical: boolean;

  @Column({ type: "jsonb" })
  metrics: Metrics;

  /** Monte Carlo standard deviations (metrics and ρ elements); null without samples. */
  @Column({ type: "jsonb", nullable: true })
  uncertainties: { metrics: Metrics; rho: Dto["rho"] } | null;

  @Column({ type: "integer", name: "monte_carlo_samples", default: 0 })
  monteCarloSamples: number;

  @Column({ type: "integer", name: "monte_carlo_seed", nullable: true })
  monteCarloSeed: number | null;

  @Column({ type: "double precision", name: "log_likelihood", nullable: true })
  logLikelihood: number | null;

  @Column({ type: "integer", nullable: true })
  iterations: number | null;

  @Column({ type: "boolean", nullable: true })
  converged: boolean | null;

  @Column({ type: "double precision", nullable: true })
  tolerance: number | null;

  @Column({ type: "double precision", name: "total_counts" })
  totalCounts: number;

  @Column({ type: "jsonb", name: "clipped_rows", default: () => "'[]'" })
  clippedRows: number[];

  @Column({ type: "jsonb", default: () => "'[]'" })
  warnings: z.infer<typeof WarningSchema>[];

  @Column({ type: "text", name: "engine_version" })
  engineVersion: string;

  @Column({ type: "uuid", name: "created_by_id", nullable: true })
  createdById: string | null;

  @ManyToOne(() => User, { onDelete: "SET NULL" })
  @JoinColumn({ name: "created_by_id" })
  createdBy?: User | null;

  @CreateDateColumn({ type: "timestamptz", name: "created_at" })
  createdAt: Date;
}
