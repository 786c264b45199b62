import type { SharedViewDto, Snapshot, SnapshotReconstruction, SnapshotRun } from "@shared/schemas/shares";
import type { Share } from "../entities/Share";
import type { Reconstruction } from "../entities/Reconstruction";
import type { Run } from "../entities/Run";
import { METHOD_WORDS, type SnapshotData, type SnapshotRunData } from "../services/shareSnapshots";

/**
 * What a shared item (and a printable report) shows, field by field. Listed explicitly — never
 * spread from an entity — so a column added later cannot leak: no people (not even display
 * names or the session's list of people), no e-mail addresses, no lab or user ids, no private
 * notes, no attachments, nothing of other runs.
 */
export function presentSnapshot(data: SnapshotData, now: Date = new Date()): Snapshot {
  const { labSession: s } = data;
  const source = s.source!;
  return {
    itemType: data.itemType,
    title: titleOf(data),
    lab: { name: data.lab.name, institution: data.lab.institution },
    setup: {
      source: { name: source.name, crystal: source.crystal, pumpLaser: source.pumpLaser, wavelengthNm: source.wavelengthNm, targetState: source.targetState },
      session: {
        title: s.title,
        date: s.date,
        pumpWavelengthNm: s.pumpWavelengthNm,
        pumpPowerMw: s.pumpPowerMw,
        crystalTemperatureC: s.crystalTemperatureC,
        coincidenceWindowNs: s.coincidenceWindowNs,
        detectors: s.detectors,
        analyser: s.analyser,
        calibration: s.calibration,
        handedness: s.handedness,
        notes: s.notesPrivate ? null : s.notes,
      },
    },
    runs: data.runs.map(presentSnapshotRun),
    focusReconstructionId: data.focusReconstructionId,
    generatedAt: now.toISOString(),
  };
}

/** A share as its recipient sees it: only when it was made and until when it works. */
export function presentSharedView(share: Share, data: SnapshotData): SharedViewDto {
  return { share: { kind: share.kind, createdAt: share.createdAt.toISOString(), expiresAt: share.expiresAt?.toISOString() ?? null }, snapshot: presentSnapshot(data) };
}

function titleOf(data: SnapshotData): string {
  if (data.itemType === "session") return data.labSession.title;
  const { run, reconstructions } = data.runs[0];
  return data.itemType === "run" ? run.name : `${run.name} — ${METHOD_WORDS[reconstructions[0].method]}`;
}

/** Runs stored before a condition existed lack its key; it reads as "not recorded". */
export const NO_CONDITIONS: Run["conditions"] = { pumpPowerMw: null, crystalTemperatureC: null, compensatorTiltDeg: null };

function presentSnapshotRun({ run, shown, revisions, reconstructions }: SnapshotRunData): SnapshotRun {
  return {
    id: run.id,
    name: run.name,
    kind: run.kind,
    settingSetId: run.settingSetId,
    notes: run.notes,
    conditions: { ...NO_CONDITIONS, ...run.conditions },
    revisionNumber: shown.number,
    countRevisions: revisions.filter((r) => r.number > 1 && r.number <= shown.number).map((r) => ({ number: r.number, reason: r.reason, createdAt: r.createdAt.toISOString() })),
    rows: shown.rows,
    totalCounts: shown.totalCounts,
    createdAt: run.createdAt.toISOString(),
    reconstructions: reconstructions.map((r) => presentSnapshotReconstruction(r, shown.number)),
  };
}

export function presentSnapshotReconstruction(r: Reconstruction, revisionNumber: number): SnapshotReconstruction {
  return {
    id: r.id,
    revisionNumber,
    method: r.method,
    corrections: r.corrections,
    conventions: r.conventions,
    rho: r.rho,
    eigenvalues: r.eigenvalues,
    physical: r.physical,
    metrics: r.metrics,
    uncertainties: r.uncertainties && r.monteCarloSeed !== null ? { samples: r.monteCarloSamples, seed: r.monteCarloSeed, metrics: r.uncertainties.metrics, rho: r.uncertainties.rho } : null,
    fit: { logLikelihood: r.logLikelihood, iterations: r.iterations, converged: r.converged, tolerance: r.tolerance },
    counts: { total: r.totalCounts, clippedRows: r.clippedRows },
    warnings: r.warnings.map((w) => ({ code: w.code, message: w.message })),
    engineVersion: r.engineVersion,
    createdAt: r.createdAt.toISOString(),
  };
}
