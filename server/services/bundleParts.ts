import type { BundleRun, SessionBundle } from "@shared/schemas/bundle";
import type { Attachment } from "../entities/Attachment";
import type { LabSession } from "../entities/LabSession";
import type { Reconstruction } from "../entities/Reconstruction";
import type { Run } from "../entities/Run";
import type { RunRevision } from "../entities/RunRevision";
import type { Source } from "../entities/Source";
import { NO_CONDITIONS, presentSnapshotReconstruction } from "../presenters/sharedSnapshot";

/**
 * Entities → the parts of a session bundle, field by field (never spread from an entity, so no
 * id, lab id or account can slip in).
 */
export function bundleSource(s: Source): SessionBundle["source"] {
  return { name: s.name, crystal: s.crystal, pumpLaser: s.pumpLaser, wavelengthNm: s.wavelengthNm, targetState: s.targetState, notes: s.notes };
}

/** Private notes are left out (empty, still marked private) unless the caller asks for them. */
export function bundleSession(s: LabSession, includePrivateNotes: boolean): SessionBundle["session"] {
  return {
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
    notes: s.notesPrivate && !includePrivateNotes ? "" : s.notes,
    notesPrivate: s.notesPrivate,
  };
}

export function bundleRun(run: Run, revisions: RunRevision[], reconstructions: Reconstruction[], attachments: Attachment[]): BundleRun {
  const numberOf = new Map(revisions.map((r) => [r.id, r.number]));
  return {
    name: run.name,
    kind: run.kind,
    settingSetId: run.settingSetId,
    notes: run.notes,
    conditions: { ...NO_CONDITIONS, ...run.conditions },
    currentRevision: run.currentRevision,
    createdAt: run.createdAt.toISOString(),
    revisions: revisions.map((v) => ({ number: v.number, rows: v.rows, reason: v.reason, changes: v.changes, createdAt: v.createdAt.toISOString() })),
    // The same fields a share shows, without the database id (an import makes new rows).
    reconstructions: reconstructions.map((c) => {
      const { id: _id, ...fields } = presentSnapshotReconstruction(c, numberOf.get(c.revisionId)!);
      return fields;
    }),
    attachments: attachments.map((a) => ({ fileName: a.fileName, contentType: a.contentType, sizeBytes: a.sizeBytes, sha256: a.sha256, contentBase64: a.content.toString("base64"), createdAt: a.createdAt.toISOString() })),
  };
}
