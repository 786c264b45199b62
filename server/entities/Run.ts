import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn } from "typeorm";
import type { z } from "zod";
import type { RunConditionsSchema, RunKind, SettingSetId } from "@shared/schemas/runs";
import { LabSession } from "./LabSession";
import { User } from "./User";

export type RunConditions = z.infer<typeof RunConditionsSchema>;

/** One counts table. Its rows live in RunRevision (immutable); `currentRevision` names the one in use. */
@Entity({ name: "runs" })
export class Run {
  @PrimaryGeneratedColumn("uuid")
  id: string;

  @Column({ type: "uuid", name: "lab_id" })
  labId: string;

  @Column({ type: "uuid", name: "session_id" })
  sessionId: string;

  @ManyToOne(() => LabSession, { onDelete: "NO ACTION" })
  @JoinColumn({ name: "session_id" })
  session?: LabSession;

  @Column({ type: "text" })
  kind: RunKind;

  @Column({ type: "text", name: "setting_set_id" })
  settingSetId: SettingSetId;

  @Column({ type: "text" })
  name: string;

  @Column({ type: "text", default: "" })
  notes: string;

  @Column({ type: "jsonb", default: () => "'{}'" })
  conditions: RunConditions;

  @Column({ type: "integer", name: "current_revision", default: 1 })
  currentRevision: number;

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
