/** Fringe-scan analysis of a stored run: one visibility fit per fixed-arm setting (shared/physics/fringe). */
import { type FringeBackground, analyseFringeRun } from "@shared/physics/fringe";
import type { FringeAnalysisDto, FringeScanQuery } from "@shared/schemas/fringe";
import { invalid } from "../http/errors";
import { engineResult, runWithCurrentRows } from "./bellAnalysis";
import { engineRows } from "./runRows";

export async function fringeScan(labId: string, runId: string, query: FringeScanQuery): Promise<FringeAnalysisDto> {
  const { run, revision } = await runWithCurrentRows(labId, runId, "fringe");
  const background = backgroundOf(query, run.session?.coincidenceWindowNs ?? null);
  const result = engineResult(() => analyseFringeRun(engineRows(revision.rows, null), background));
  return {
    runId: run.id,
    runName: run.name,
    sessionId: run.sessionId,
    revisionNumber: revision.number,
    background: {
      kind: background.kind,
      windowNs: background.kind === "accidentals" ? background.windowNs : null,
      rate: background.kind === "rate" ? background.perSecond : null,
      sigma: background.kind === "rate" ? background.sigma : 0,
    },
    scans: result.scans.map((s) => ({
      ...s,
      points: s.points.map((p) => ({
        angleDeg: p.angleDeg,
        counts: p.counts,
        seconds: p.seconds ?? 1,
        backgroundCounts: p.backgroundCounts ?? (background.kind === "rate" ? background.perSecond * (p.seconds ?? 1) : 0),
      })),
    })),
    byBasis: result.byBasis.map((b) => ({ ...b, sigma: Number.isFinite(b.sigma) ? b.sigma : null })),
  };
}

function backgroundOf(query: FringeScanQuery, sessionWindowNs: number | null): FringeBackground {
  if (query.background === "rate") return { kind: "rate", perSecond: query.backgroundRate!, sigma: query.backgroundSigma };
  if (query.background === "accidentals") {
    const windowNs = query.windowNs ?? sessionWindowNs;
    if (!windowNs) throw invalid("windowNs", "Give the coincidence window (ns): the session does not record one.");
    return { kind: "accidentals", windowNs };
  }
  return { kind: "none" };
}
