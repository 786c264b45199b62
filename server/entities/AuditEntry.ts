import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from "typeorm";

/** One write to the notebook: who did what to which record, and the fields it changed. */
@Entity({ name: "audit_entries" })
export class AuditEntry {
  @PrimaryGeneratedColumn("uuid")
  id: string;

  @Column({ type: "uuid", name: "lab_id" })
  labId: string;

  @Column({ type: "uuid", name: "actor_id", nullable: true })
  actorId: string | null;

  /** e.g. "run.create", "run.revise", "source.update" */
  @Column({ type: "text" })
  action: string;

  @Column({ type: "text", name: "entity_type" })
  entityType: string;

  @Column({ type: "uuid", name: "entity_id" })
  entityId: string;

  @Column({ type: "jsonb", default: () => "'{}'" })
  changes: Record<string, unknown>;

  @CreateDateColumn({ type: "timestamptz", name: "created_at" })
  createdAt: Date;
}
