import type { ReconstructionDto } from "@shared/schemas/reconstructions";
import type { SnapshotReconstruction, SnapshotRun } from "@shared/schemas/shares";

/**
 * The state-view components (scorecard, key figures, fit details, checks) take the lab's
 * reconstruction DTO. A snapshot's reconstruction has every field they read; the lab-only
 * fields (ids, author, allowed actions) are filled with neutral values that nothing displays.
 */
export function asReconstructionDto(rec: SnapshotReconstruction, run: SnapshotRun): ReconstructionDto {
  return { ...rec, labId: "", runId: run.id, revisionId: "", createdBy: null, can: { read: true, write: false, manage: false } };
}

/** The reconstruction shown first: maximum likelihood, newest first, else the newest. */
export function defaultOf(run: SnapshotRun): SnapshotReconstruction | undefined {
  return run.reconstructions.find((r) => r.method === "mle") ?? run.reconstructions[0];
}
