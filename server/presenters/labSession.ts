import type { LabSessionDto } from "@shared/schemas/labSessions";
import type { LabRole } from "@shared/schemas/roles";
import type { LabSession } from "../entities/LabSession";
import { allowedActions } from "../policies/labAccess";
import { presentPerson } from "./person";

/** Expects `source` and `createdBy` loaded. */
export function presentLabSession(s: LabSession, runCount: number, role: LabRole): LabSessionDto {
  return {
    id: s.id,
    labId: s.labId,
    sourceId: s.sourceId,
    source: { id: s.sourceId, name: s.source?.name ?? "" },
    title: s.title,
    date: s.date,
    people: s.people,
    pumpWavelengthNm: s.pumpWavelengthNm,
    pumpPowerMw: s.pumpPowerMw,
    crystalTemperatureC: s.crystalTemperatureC,
    coincidenceWindowNs: s.coincidenceWindowNs,
    detectors: s.detectors,
    analyser: s.analyser,
    calibration: s.calibration,
    handedness: s.handedness,
    notes: s.notes,
    notesPrivate: s.notesPrivate,
    runCount,
    createdBy: presentPerson(s.createdBy),
    createdAt: s.createdAt.toISOString(),
    updatedAt: s.updatedAt.toISOString(),
    can: allowedActions(role),
  };
}
