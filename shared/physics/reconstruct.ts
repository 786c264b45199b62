/**
 * One entry point for the three estimators (physics contract §4). Inputs and outputs are plain
 * JSON; `prepareProblem` + `solveProblem` let Monte Carlo reuse the measurement model.
 *
 * Reported log-likelihood: L = Σ[n ln μ − μ] at ŝ·ρ̂ with the best scale ŝ = N / Σ_k w_k Tr(ρ̂ P_k)
 * (for the MLE that is its own optimum), so the three methods can be compared; null when a
 * row with counts would get μ ≤ 0 (possible for a non-physical linear estimate).
 */
import type { CountsRow, DensityMatrix, Method, SetupConventions } from "./types";
import { buildModel, type MeasurementModel } from "./measurementModel";
import { prepareCounts, type CorrectionOptions, type PreparedCounts } from "./corrections";
import { prepareLinearSystem, linearInversionSigma, type LinearSystem } from "./linearInversion";
import { projectToDensityMatrix } from "./projectedLeastSquares";
import { maximumLikelihood, type MleOptions, type MleResult } from "./maximumLikelihood";
import { expectedCounts, logLikelihood, rescaled } from "./likelihood";
import { type CMatrix, hermitianPart, identity, scale, toPlain, traceRe } from "./linalg/complexMatrix";
import { hermitianEigenvalues } from "./linalg/hermitianEigen";
import { DEFAULT_HANDEDNESS } from "./states";
import { EngineInputError } from "./errors";
import { ENGINE_VERSION } from "./version";
import { PHYSICAL_TOLERANCE } from "./tolerances";

export interface ReconstructInput {
  rows: CountsRow[];
  conventions?: SetupConventions;
}

export interface ReconstructOptions extends CorrectionOptions, MleOptions {
  method: Method;
}

export interface Reconstruction {
  engineVersion: string;
  method: Method;
  photons: number;
  dimension: number;
  /** Unit-trace estimate, basis order HH, HV, VH, VV (photon A first). */
  rho: DensityMatrix;
  /** Eigenvalues of ρ, descending (negative ones mean a non-physical estimate). */
  eigenvalues: number[];
  physical: boolean;
  /** Tr σ: detected pairs per second at efficiency 1. */
  pairRate: number;
  logLikelihood: number | null;
  iterations: number | null;
  converged: boolean | null;
  optimalityGap: number | null;
  tolerance: number | null;
  /** μ_k of the estimate, per row (what Monte Carlo resamples). */
  expectedCounts: number[];
  /** The counts the estimator used, after accidental subtraction. */
  correctedCounts: number[];
  accidentals: number[] | null;
  clippedRows: number;
  clippedRowIndices: number[];
  driftFactors: number[] | null;
  totalCounts: number;
  corrections: CorrectionOptions;
  conventions: { handedness: string; basisOrder: string[]; photonOrder: string; calibration: SetupConventions["calibration"] | null };
  warnings: string[];
}

export interface PreparedProblem {
  model: MeasurementModel;
  linear: LinearSystem;
  data: PreparedCounts;
}

export function prepareProblem(input: ReconstructInput, options: CorrectionOptions = {}): PreparedProblem {
  const model = wrap(() => buildModel(input.rows.map((r) => r.setting), input.conventions));
  const data = wrap(() => prepareCounts(input.rows, options));
  const linear = prepareLinearSystem(model);
  return { model, linear, data };
}

export interface Estimate {
  sigma: CMatrix;
  mle?: MleResult;
}

/** Runs one estimator on prepared data (the data may differ from problem.data, e.g. resampled). */
export function solveProblem(problem: PreparedProblem, data: PreparedCounts, options: ReconstructOptions): Estimate {
  if (!(data.totalCounts > 0)) throw new EngineInputError("no_counts", "All rows have zero counts (after corrections); there is nothing to reconstruct.");
  const rates = data.counts.map((n, k) => n / data.weights[k]);
  const linear = finite(linearInversionSigma(problem.linear, rates), rates);
  if (options.method === "linear") return { sigma: linear };
  if (options.method === "projected") return { sigma: finite(rescaled(problem.model, data, projectedOrMixed(linear)), rates) };
  const mle = maximumLikelihood(problem.model, problem.linear, data, { linear, positive: () => projectedOrMixed(linear) }, options);
  return { sigma: finite(mle.sigma, rates), mle };
}

/**
 * A weight near zero or an overflow (a subnormal exposure, a drift factor from a monitor
 * reading of 1e308) leaves no finite estimate; say so rather than fail later on NaN.
 */
function finite(sigma: CMatrix, rates: Float64Array): CMatrix {
  if (sigma.re.every(Number.isFinite) && sigma.im.every(Number.isFinite)) return sigma;
  const row = rates.findIndex((r) => !Number.isFinite(r));
  throw new EngineInputError("invalid_input", `${row >= 0 ? `row ${row + 1}: ` : ""}the exposures, efficiencies and drift-monitor readings span too many orders of magnitude for a finite estimate; check them`);
}

function largestEntry(sigma: CMatrix): number {
  let m = 0;
  for (let i = 0; i < sigma.re.length; i++) m = Math.max(m, Math.abs(sigma.re[i]), Math.abs(sigma.im[i]));
  return m;
}

export function reconstruct(input: ReconstructInput, options: ReconstructOptions): Reconstruction {
  const problem = prepareProblem(input, options);
  const estimate = solveProblem(problem, problem.data, options);
  return describe(problem, estimate, input, options);
}

export function describe(problem: PreparedProblem, estimate: Estimate, input: ReconstructInput, options: ReconstructOptions): Reconstruction {
  const { model, data } = problem;
  const trace = traceRe(estimate.sigma);
  // A trace at rounding level next to the entries (e.g. 1 count in HH…VV beside 10^15 elsewhere)
  // is no pair rate at all: normalising by it would return entries of order 10^15.
  const resolvable = 64 * Number.EPSILON * model.dimension * largestEntry(estimate.sigma);
  if (!(trace > resolvable && Number.isFinite(trace))) {
    throw new EngineInputError("invalid_input", `The estimate has trace ${trace}${trace > 0 ? `, below the rounding level of its entries (${resolvable.toPrecision(2)})` : ""}, so it cannot be normalised to a state: the counts leave the pair rate undetermined (no counts in any complete basis, or far fewer there than in the other rows?).`);
  }
  const rho = hermitianPart(scale(estimate.sigma, 1 / trace));
  const eigenvalues = Array.from(hermitianEigenvalues(rho));
  const physical = eigenvalues[eigenvalues.length - 1] >= -PHYSICAL_TOLERANCE;
  const mu = expectedCounts(model, data.weights, estimate.sigma);
  const best = estimate.mle ? mu : expectedCounts(model, data.weights, rescaled(model, data, rho));
  const l = logLikelihood(data.counts, best);
  const warnings: string[] = [];
  if (!physical) warnings.push(`The estimate is not physical: its smallest eigenvalue is ${eigenvalues[eigenvalues.length - 1].toPrecision(3)}. Figures of merit computed from it are marked as such.`);
  if (data.clippedRows.length) warnings.push(`${data.clippedRows.length} row(s) had fewer counts than estimated accidentals and were clipped to 0.`);
  if (estimate.mle && !estimate.mle.converged) warnings.push(`Maximum likelihood stopped before reaching its tolerance (optimality gap ${estimate.mle.optimalityGap.toPrecision(3)} nats).`);
  const { windowNs, drift } = options;
  return {
    engineVersion: ENGINE_VERSION,
    method: options.method,
    photons: model.photons,
    dimension: model.dimension,
    rho: toPlain(rho),
    eigenvalues,
    physical,
    pairRate: trace,
    logLikelihood: Number.isFinite(l) ? l : null,
    iterations: estimate.mle?.iterations ?? null,
    converged: estimate.mle?.converged ?? null,
    optimalityGap: estimate.mle?.optimalityGap ?? null,
    tolerance: estimate.mle?.tolerance ?? null,
    expectedCounts: Array.from(mu),
    correctedCounts: Array.from(data.counts),
    accidentals: data.accidentals ? Array.from(data.accidentals) : null,
    clippedRows: data.clippedRows.length,
    clippedRowIndices: data.clippedRows,
    driftFactors: data.driftFactors ? Array.from(data.driftFactors) : null,
    totalCounts: data.totalCounts,
    corrections: { ...(windowNs !== undefined && { windowNs }), ...(drift && { drift }) },
    conventions: {
      handedness: input.conventions?.handedness ?? DEFAULT_HANDEDNESS,
      basisOrder: basisLabels(model.photons),
      photonOrder: "photon A is the first tensor factor",
      calibration: input.conventions?.calibration ?? null,
    },
    warnings,
  };
}

/** "HH", "HV", "VH", "VV" for two photons; binary order with H = 0, photon A first. */
export function basisLabels(photons: number): string[] {
  return Array.from({ length: 2 ** photons }, (_, b) =>
    Array.from({ length: photons }, (_, i) => ((b >> (photons - 1 - i)) & 1 ? "V" : "H")).join(""),
  );
}

function projectedOrMixed(linear: CMatrix): CMatrix {
  return traceRe(linear) > 0 ? projectToDensityMatrix(linear) : identity(linear.n);
}

function wrap<T>(f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (e instanceof EngineInputError) throw e;
    throw new EngineInputError("invalid_input", (e as Error).message);
  }
}
