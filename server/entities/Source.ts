import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn } from "typeorm";
import type { BellTarget } from "@shared/schemas/sources";
import { User } from "./User";

/** A photon-pair source under test (e.g. a crystal in a Sagnac loop). */
@Entity({ name: "sources" })
export class Source {
  @PrimaryGeneratedColumn("uuid")
  id: string;

  @Column({ type: "uuid", name: "lab_id" })
  labId: string;

  @Column({ type: "text" })
  name: string;

  @Column({ type: "text", default: "" })
  crystal: string;

  @Column({ type: "text", name: "pump_laser", default: "" })
  pumpLaser: string;

  @Column({ type: "double precision", name: "wavelength_nm", nullable: true })
  wavelengthNm: number | null;

  @Column({ type: "text", name: "target_state", default: "psi-" })
  targetState: BellTarget;

  @Column({ type: "text", default: "" })
  notes: string;

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
