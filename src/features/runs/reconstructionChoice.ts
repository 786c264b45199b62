/**
 * Which stored reconstruction the state view shows when the reader switches method or
 * corrections: the newest one of the current counts that matches, else the newest of that method.
 */
import type { Corrections, ReconstructionDto, ReconstructionMethod } from "@shared/schemas/reconstructions";

export function sameCorrections(a: Corrections, b: Corrections): boolean {
  return a.accidentals === b.accidentals && (a.accidentals ? a.windowNs === b.windowNs : true) && a.drift === b.drift && JSON.stringify(a.efficiencies) === JSON.stringify(b.efficiencies);
}

/** Newest first, as the API sends them; only those of `revision`. */
export function ofRevision(list: ReconstructionDto[], revision: number): ReconstructionDto[] {
  return list.filter((r) => r.revisionNumber === revision).sort((a, b) => b.createdAt.localeCompare(a.createdAt));
}

export function pickReconstruction(list: ReconstructionDto[], revision: number, method: ReconstructionMethod, corrections?: Corrections): ReconstructionDto | undefined {
  const current = ofRevision(list, revision).filter((r) => r.method === method);
  return (corrections && current.find((r) => sameCorrections(r.corrections, corrections))) ?? current[0];
}

/**
 * What the method switch shows: the reader's chosen reconstruction when its method is picked
 * again, else the newest of that method with the chosen one's corrections, else the newest of
 * that method. Keyed on the choice, not on what is shown, so a detour through a method that has
 * only raw-count results does not lose the corrections.
 */
export function reconstructionForMethod(list: ReconstructionDto[], revision: number, chosen: ReconstructionDto, method: ReconstructionMethod): ReconstructionDto | undefined {
  if (method === chosen.method && chosen.revisionNumber === revision) return chosen;
  return pickReconstruction(list, revision, method, chosen.corrections);
}

/** The one the page opens with: maximum likelihood if there is one, else the newest. */
export function defaultReconstruction(list: ReconstructionDto[], revision: number): ReconstructionDto | undefined {
  return pickReconstruction(list, revision, "mle") ?? ofRevision(list, revision)[0];
}

/** "accidentals subtracted (τ = 3 ns), drift by singles" — or "no corrections". */
export function describeCorrections(c: Corrections): string {
  const parts: string[] = [];
  if (c.accidentals) parts.push(`accidentals subtracted${c.windowNs !== null ? ` (τ = ${c.windowNs} ns)` : ""}`);
  if (c.efficiencies) parts.push("detector efficiencies applied");
  if (c.drift !== "none") parts.push(c.drift === "singles" ? "drift normalised by singles" : "drift normalised by the monitor");
  return parts.length ? parts.join(", ") : "raw counts, no corrections";
}
