import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryColumn } from "typeorm";
import type { LabRole } from "@shared/schemas/roles";
import { Lab } from "./Lab";
import { User } from "./User";

@Entity({ name: "lab_memberships" })
export class LabMembership {
  @PrimaryColumn({ type: "uuid", name: "lab_id" })
  labId: string;

  @PrimaryColumn({ type: "uuid", name: "user_id" })
  userId: string;

  @Column({ type: "text" })
  role: LabRole;

  @CreateDateColumn({ type: "timestamptz", name: "created_at" })
  createdAt: Date;

  @ManyToOne(() => Lab, { onDelete: "CASCADE" })
  @JoinColumn({ name: "lab_id" })
  lab?: Lab;

  @ManyToOne(() => User, { onDelete: "CASCADE" })
  @JoinColumn({ name: "user_id" })
  user?: User;
}
