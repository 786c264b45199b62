/**
 * The server's one door into the numeric core (shared/physics): stored rows, the session's
 * setup and a reconstruction request in; everything a Reconstruction row stores out. Engine
 * input errors become 400s that name the row and column ("rows.3.singlesA") or the parameter.
 */
import type { Corrections, ReconstructionMethod } from "@shared/schemas/reconstructions";
import type { CountsRowDto, SettingSetId } from "@shared/schemas/runs";
import type { BellTarget } from "@shared/schemas/sources";
import { EngineInputError, reconstruct, standardSet, type SetupConventions } from "@shared/physics";
import type { LabSession } from "../entities/LabSession";
import type { Reconstruction } from "../entities/Reconstruction";
import { HttpError, invalid } from "../http/errors";
import { engineRows } from "./runRows";
import { figuresOf, uncertaintiesOf } from "./engineFigures";
import { monteCarloPool } from "./monteCarlo";

export interface ReconstructionJob {
  rows: CountsRowDto[];
  settingSetId: SettingSetId;
  labSession: LabSession;
  /** The source's target state: Monte Carlo reports σ of the fidelity to it. */
  target: BellTarget;
  method: ReconstructionMethod;
  corrections: Corrections;
  samples: number;
  seed: number;
  /** Where the corrections sit in the request body, for error fields ("corrections" or "reconstruction.corrections"). */
  fieldPrefix: string;
}

export type ComputedReconstruction = Pick<
  Reconstruction,
  | "method" | "corrections" | "conventions" | "rho" | "eigenvalues" | "physical" | "metrics" | "uncertainties" | "monteCarloSamples"
  | "monteCarloSeed" | "logLikelihood" | "iterations" | "converged" | "tolerance" | "totalCounts" | "clippedRows" | "warnings" | "engineVersion"
>;

/** The setup conventions a session implies for a set: two-detector sets count both ports. */
export function conventionsOf(labSession: LabSession, settingSetId: SettingSetId): ComputedReconstruction["conventions"] {
  const bothPortsSet = settingSetId !== "custom" && standardSet(settingSetId).bothPorts;
  return {
    handedness: labSession.handedness,
    calibration: labSession.calibration,
    bothPorts: labSession.analyser.arms.map((a) => bothPortsSet || a.bothPorts),
  };
}

/** Fills in what a correction request leaves to the session (the coincidence window). */
export function resolveCorrections(c: Corrections, labSession: LabSession, rowCount: number, prefix: string): Corrections {
  if (c.efficiencies && c.efficiencies.length !== rowCount) {
    throw invalid(`${prefix}.efficiencies`, `Give one efficiency per row: ${rowCount} values, not ${c.efficiencies.length}.`);
  }
  if (!c.accidentals) return { ...c, windowNs: null };
  const windowNs = c.windowNs ?? labSession.coincidenceWindowNs;
  if (windowNs === null) throw invalid(`${prefix}.windowNs`, "Accidental subtraction needs the coincidence window: set it on the session or give windowNs.");
  return { ...c, windowNs };
}

export async function computeReconstruction(job: ReconstructionJob): Promise<ComputedReconstruction> {
  const corrections = resolveCorrections(job.corrections, job.labSession, job.rows.length, job.fieldPrefix);
  const conventions = conventionsOf(job.labSession, job.settingSetId);
  const input = { rows: engineRows(job.rows, corrections.efficiencies), conventions: conventions as SetupConventions };
  const options = {
    method: job.method,
    ...(corrections.windowNs !== null && { windowNs: corrections.windowNs }),
    ...(corrections.drift !== "none" && { drift: corrections.drift }),
  };
  const result = engineCall(() => reconstruct(input, options), job.fieldPrefix);
  const mc = job.samples > 0 ? await engineCallAsync(() => monteCarloPool().run(input, options, { samples: job.samples, seed: job.seed, target: job.target }, result), job.fieldPrefix) : null;
  const spread = mc ? uncertaintiesOf(mc, job.target) : null;
  return {
    method: job.method,
    corrections,
    conventions,
    rho: result.rho,
    eigenvalues: result.eigenvalues,
    physical: result.physical,
    metrics: figuresOf(result.rho),
    uncertainties: spread,
    monteCarloSamples: spread ? job.samples : 0,
    monteCarloSeed: spread ? job.seed : null,
    logLikelihood: result.logLikelihood,
    iterations: result.iterations,
    converged: result.converged,
    tolerance: result.tolerance,
    totalCounts: result.totalCounts,
    clippedRows: result.clippedRowIndices,
    warnings: result.warnings.map((message) => ({ code: warningCode(message), message })),
    engineVersion: result.engineVersion,
  };
}

function warningCode(message: string): string {
  if (/not physical/i.test(message)) return "not_physical";
  if (/clipped/i.test(message)) return "accidentals_clipped";
  if (/Maximum likelihood stopped/i.test(message)) return "not_converged";
  return "engine";
}

function engineCall<T>(f: () => T, prefix: string): T {
  try {
    return f();
  } catch (e) {
    throw engineError(e, prefix);
  }
}

async function engineCallAsync<T>(f: () => Promise<T>, prefix: string): Promise<T> {
  try {
    return await f();
  } catch (e) {
    throw engineError(e, prefix);
  }
}

/**
 * The engine says "row 4, field "singlesA": …" (1-based) or names a parameter; the API names
 * the same place as a dotted path into the request ("rows.3.singlesA").
 */
export function engineError(e: unknown, prefix: string): unknown {
  if (e instanceof HttpError) return e;
  if (!(e instanceof EngineInputError) && !(e instanceof Error && /^(row \d+|field ")/.test(e.message))) return e;
  const message = (e as Error).message;
  const cell = /^row (\d+), field "(\w+)": (.*)$/s.exec(message);
  if (cell) {
    const row = Number(cell[1]) - 1;
    const field = cell[2] === "efficiency" ? `${prefix}.efficiencies.${row}` : `rows.${row}.${cell[2]}`;
    return invalid(field, cell[3]);
  }
  const rowOnly = /^row (\d+)[,:] (.*)$/s.exec(message);
  if (rowOnly) return invalid(`rows.${Number(rowOnly[1]) - 1}.setting`, rowOnly[2]);
  const param = /^field "(\w+)": (.*)$/s.exec(message);
  if (param) return invalid(`${prefix}.${param[1]}`, param[2]);
  return invalid("rows", message);
}
