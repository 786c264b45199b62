import type { LabDto } from "@shared/schemas/labs";
import type { LabRole } from "@shared/schemas/roles";
import type { Lab } from "../entities/Lab";
import { allowedActions } from "../policies/labAccess";

export function presentLab(lab: Lab, role: LabRole): LabDto {
  return { id: lab.id, name: lab.name, institution: lab.institution, role, createdAt: lab.createdAt.toISOString(), can: allowedActions(role) };
}
