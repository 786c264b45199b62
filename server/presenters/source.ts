import type { SourceDto } from "@shared/schemas/sources";
import type { LabRole } from "@shared/schemas/roles";
import type { Source } from "../entities/Source";
import { allowedActions } from "../policies/labAccess";
import { presentPerson } from "./person";

export function presentSource(source: Source, sessionCount: number, role: LabRole): SourceDto {
  return {
    id: source.id,
    labId: source.labId,
    name: source.name,
    crystal: source.crystal,
    pumpLaser: source.pumpLaser,
    wavelengthNm: source.wavelengthNm,
    targetState: source.targetState,
    notes: source.notes,
    sessionCount,
    createdBy: presentPerson(source.createdBy),
    createdAt: source.createdAt.toISOString(),
    updatedAt: source.updatedAt.toISOString(),
    can: allowedActions(role),
  };
}
