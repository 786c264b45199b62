import type { ShareItemType, Snapshot } from "@shared/schemas/shares";
import { countsFile, reconstructionFile, snapshotMetricsFile, type ExportFile, type ReconstructionFileKind } from "@shared/formats/snapshotExports";
import { notFound } from "../http/errors";
import { presentSnapshot } from "../presenters/sharedSnapshot";
import { loadSnapshotData } from "./shareSnapshots";

/**
 * The lab's export files. They are built from the same snapshot a share shows, so an export
 * carries exactly what a share would: results, parameters, raw counts, setup — no people, no
 * e-mail addresses, no private notes, nothing of other runs.
 */
export async function snapshotOf(labId: string, itemType: ShareItemType, itemId: string): Promise<Snapshot> {
  return presentSnapshot(await loadSnapshotData(labId, itemType, itemId));
}

/** Raw rows of the run's current revision, or of revision `number`. */
export async function runCountsFile(labId: string, runId: string, number?: number): Promise<ExportFile> {
  const data = await loadSnapshotData(labId, "run", runId);
  const snapshot = presentSnapshot(data);
  const run = snapshot.runs[0];
  if (number === undefined || number === run.revisionNumber) return countsFile(snapshot, run);
  const revision = data.runs[0].revisions.find((r) => r.number === number);
  if (!revision) throw notFound(`Revision ${number} of this run`);
  return countsFile(snapshot, run, { number, rows: revision.rows });
}

export async function reconstructionExportFile(labId: string, reconstructionId: string, kind: ReconstructionFileKind): Promise<ExportFile> {
  const snapshot = await snapshotOf(labId, "reconstruction", reconstructionId);
  const run = snapshot.runs[0];
  return reconstructionFile(snapshot, run, run.reconstructions[0], kind);
}

/** Figures of merit of every reconstruction of the session's current counts. */
export async function sessionMetricsFile(labId: string, sessionId: string, kind: "metrics.csv" | "metrics.json"): Promise<ExportFile> {
  return snapshotMetricsFile(await snapshotOf(labId, "session", sessionId), kind);
}
