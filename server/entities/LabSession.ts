import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn } from "typeorm";
import type { z } from "zod";
import type { AnalyserSchema, ArmCalibrationSchema } from "@shared/schemas/labSessions";
import type { Handedness } from "@shared/physics/types";
import { Source } from "./Source";
import { User } from "./User";

export type Analyser = z.infer<typeof AnalyserSchema>;
export type ArmCalibrationRecord = z.infer<typeof ArmCalibrationSchema>;

/** One measurement session on one setup (never "Session": that is the sign-in session). */
@Entity({ name: "lab_sessions" })
export class LabSession {
  @PrimaryGeneratedColumn("uuid")
  id: string;

  @Column({ type: "uuid", name: "lab_id" })
  labId: string;

  @Column({ type: "uuid", name: "source_id" })
  sourceId: string;

  @ManyToOne(() => Source, { onDelete: "NO ACTION" })
  @JoinColumn({ name: "source_id" })
  source?: Source;

  @Column({ type: "text" })
  title: string;

  /** YYYY-MM-DD (PostgreSQL date; TypeORM hands it over as a string). */
  @Column({ type: "date", name: "session_date" })
  date: string;

  @Column({ type: "jsonb", default: () => "'[]'" })
  people: string[];

  @Column({ type: "double precision", name: "pump_wavelength_nm", nullable: true })
  pumpWavelengthNm: number | null;

  @Column({ type: "double precision", name: "pump_power_mw", nullable: true })
  pumpPowerMw: number | null;

  @Column({ type: "double precision", name: "crystal_temperature_c", nullable: true })
  crystalTemperatureC: number | null;

  @Column({ type: "double precision", name: "coincidence_window_ns", nullable: true })
  coincidenceWindowNs: number | null;

  @Column({ type: "text", default: "" })
  detectors: string;

  @Column({ type: "jsonb" })
  analyser: Analyser;

  /** Per arm, photon A first. */
  @Column({ type: "jsonb" })
  calibration: ArmCalibrationRecord[];

  @Column({ type: "text", default: "R=H+iV" })
  handedness: Handedness;

  @Column({ type: "text", default: "" })
  notes: string;

  @Column({ type: "boolean", name: "notes_private", default: false })
  notesPrivate: boolean;

  @Column({ type: "uuid", name: "created_by_id", nullable: true })
  createdById: string | null;

  @ManyToOne(() => User, { onDelete: "SET NULL" })
  @JoinColumn({ name: "created_by_id" })
  createdBy?: User | null;

  @CreateDateColumn({ type: "timestamptz", name: "created_at" })
  createdAt: Date;

  @UpdateDateColumn({ type: "timestamptz", name: "updated_at" })
  updatedAt: Date;
}
