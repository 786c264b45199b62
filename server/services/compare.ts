import type { CompareQuery } from "@shared/schemas/compare";
import { METRIC_KEYS, type MetricKey } from "@shared/schemas/reconstructions";
import { uhlmannFidelity } from "@shared/physics/fidelity";
import { add, fromPlain, hermitianPart } from "@shared/physics/linalg/complexMatrix";
import { hermitianEigenvalues } from "@shared/physics/linalg/hermitianEigen";
import type { DensityMatrix } from "@shared/physics/types";
import { db } from "../db/dataSource";
import type { Reconstruction } from "../entities/Reconstruction";
import { invalid } from "../http/errors";
import { findReconstructions } from "./reconstructions";
import { loadRunSummaries, type RunSummary } from "./runQueries";

export interface CompareItem {
  summary: RunSummary;
  reconstruction: Reconstruction;
  revisionNumber: number;
}

export interface Difference {
  runId: string;
  relativeToRunId: string;
  metrics: Record<string, { delta: number; uncertainty: number | null }>;
  rho: DensityMatrix;
  traceDistance: number;
  fidelityBetween: number | null;
}

/** The chosen reconstructions (newest of `method` per run, or exactly the ones named) and their differences to the first. */
export async function compare(labId: string, query: CompareQuery): Promise<{ items: CompareItem[]; differences: Difference[] }> {
  const picked = query.reconstructions ? await byReconstruction(labId, query.reconstructions) : query.runs ? await byRun(labId, query.runs, query.method) : [];
  const summaries = await loadRunSummaries(picked.map((r) => r.runId));
  const items = picked.map((reconstruction, i) => ({ summary: summaries[i], reconstruction, revisionNumber: reconstruction.revision!.number }));
  if (items.some((i) => !sameShape(i.reconstruction.rho, items[0].reconstruction.rho))) {
    throw invalid(query.runs ? "runs" : "reconstructions", "These runs have different numbers of photons; only states of the same size can be compared.");
  }
  return { items, differences: items.slice(1).map((item) => difference(items[0], item)) };
}

async function byReconstruction(labId: string, ids: string[]): Promise<Reconstruction[]> {
  const found = new Map((await findReconstructions(labId, ids)).map((r) => [r.id, r]));
  return ids.map((id, i) => found.get(id) ?? notInLab("reconstructions", i, "No such reconstruction in this lab."));
}

async function byRun(labId: string, runIds: string[], method: CompareQuery["method"]): Promise<Reconstruction[]> {
  const rows: Array<{ run_id: string; id: string }> = await db().query(
    `SELECT DISTINCT ON (r.id) r.id AS run_id, rc.id
     FROM runs r
     JOIN run_revisions rv ON rv.run_id = r.id AND rv.number = r.current_revision
     JOIN reconstructions rc ON rc.revision_id = rv.id AND rc.method = $3
     WHERE r.lab_id = $1 AND r.id = ANY($2)
     ORDER BY r.id, rc.created_at DESC, rc.id DESC`,
    [labId, runIds, method],
  );
  const recOfRun = new Map(rows.map((r) => [r.run_id, r.id]));
  const missing = runIds.findIndex((id) => !recOfRun.has(id));
  if (missing >= 0) notInLab("runs", missing, `No run of this lab with a ${method} reconstruction of its current counts.`);
  return byReconstruction(labId, runIds.map((id) => recOfRun.get(id)!));
}

function notInLab(field: string, index: number, message: string): never {
  throw invalid(`${field}.${index}`, message);
}

function sameShape(a: DensityMatrix, b: DensityMatrix): boolean {
  return a.re.length === b.re.length;
}

function difference(first: CompareItem, item: CompareItem): Difference {
  const a = first.reconstruction;
  const b = item.reconstruction;
  const metrics: Difference["metrics"] = {};
  for (const key of METRIC_KEYS as readonly MetricKey[]) {
    const x = a.metrics[key];
    const y = b.metrics[key];
    if (x === null || y === null) continue;
    const sa = a.uncertainties?.metrics[key];
    const sb = b.uncertainties?.metrics[key];
    metrics[key] = { delta: y - x, uncertainty: sa != null && sb != null ? Math.hypot(sa, sb) : null };
  }
  const rhoA = hermitianPart(fromPlain(a.rho));
  const rhoB = hermitianPart(fromPlain(b.rho));
  const delta = add(rhoB, rhoA, -1);
  let traceNorm = 0;
  for (const l of hermitianEigenvalues(delta)) traceNorm += Math.abs(l);
  return {
    runId: b.runId,
    relativeToRunId: a.runId,
    metrics,
    rho: { re: b.rho.re.map((row, i) => row.map((v, j) => v - a.rho.re[i][j])), im: b.rho.im.map((row, i) => row.map((v, j) => v - a.rho.im[i][j])) },
    // ½‖ρ₂ − ρ₁‖₁ (Nielsen & Chuang, "Quantum Computation and Quantum Information" (2000), §9.2.1).
    traceDistance: traceNorm / 2,
    fidelityBetween: a.physical && b.physical ? uhlmannFidelity(rhoA, rhoB) : null,
  };
}
