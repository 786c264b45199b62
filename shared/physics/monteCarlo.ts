/**
 * Monte Carlo uncertainties (physics contract §5; James et al., Phys. Rev. A 64, 052312 (2001),
 * §VI discuss the approach; common practice): draw n_k* ~ Poisson(μ̂_k + A_k) from the fitted
 * expectation (plus the estimated accidentals when they are subtracted, so that the resampled
 * raw counts go through the same corrections), reconstruct with the same method, and report the
 * sample standard deviation of every figure of merit and matrix element.
 *
 * Sample i uses random stream i of the seed (see random.ts), so splitting the samples over
 * threads (server/workers) gives bit-identical results.
 */
import type { DensityMatrix, Target } from "./types";
import type { PreparedCounts } from "./corrections";
import { prepareProblem, reconstruct, solveProblem, type PreparedProblem, type Reconstruction, type ReconstructInput, type ReconstructOptions } from "./reconstruct";
import { figuresOfMerit } from "./figuresOfMerit";
import { hermitianPart, scale, traceRe } from "./linalg/complexMatrix";
import { newSeed, poisson, randomStreams } from "./random";
import { EngineInputError } from "./errors";

export const DEFAULT_SAMPLES = 200;
export const MAX_SAMPLES = 10_000;

export const METRIC_NAMES = [
  "fidelity", "concurrence", "tangle", "purity", "linearEntropy", "vonNeumannEntropy", "negativity", "chshMax", "phaseOptimisedFidelity",
] as const;
export type MetricName = (typeof METRIC_NAMES)[number];

export interface MonteCarloOptions {
  samples?: number;
  seed?: number;
  target?: Target | null;
}

/** Per-sample values of one block of samples (plain arrays: they cross thread boundaries). */
export interface SampleBlock {
  from: number;
  /** metrics[name][i] for sample from + i; NaN where undefined (e.g. a failed sample). */
  metrics: Record<MetricName, number[]>;
  /** Row-major ρ entries per sample. */
  rhoRe: number[][];
  rhoIm: number[][];
  failed: number;
}

export interface MonteCarloResult {
  seed: number;
  samples: number;
  method: string;
  /** Samples whose reconstruction failed (e.g. all counts zero); left out of the statistics. */
  failed: number;
  std: Record<MetricName, number | null> & { rho: DensityMatrix };
  mean: Record<MetricName, number | null>;
}

export function resolveSamples(options: MonteCarloOptions): { samples: number; seed: number } {
  const samples = options.samples ?? DEFAULT_SAMPLES;
  if (!Number.isInteger(samples) || samples < 2 || samples > MAX_SAMPLES) {
    throw new EngineInputError("invalid_input", `field "samples": must be a whole number from 2 to ${MAX_SAMPLES}, got ${samples}`);
  }
  const seed = options.seed ?? newSeed();
  if (!Number.isInteger(seed)) throw new EngineInputError("invalid_input", `field "seed": must be a whole number, got ${seed}`);
  return { samples, seed };
}

/** The whole run in this thread. */
export function monteCarlo(input: ReconstructInput, options: ReconstructOptions, mc: MonteCarloOptions = {}, base?: Reconstruction): MonteCarloResult {
  const { samples, seed } = resolveSamples(mc);
  const fitted = base ?? reconstruct(input, options);
  const block = monteCarloBlock(input, options, fitted.expectedCounts, seed, 0, samples, mc.target === undefined ? "phi+" : mc.target);
  return summariseMonteCarlo([block], seed, options.method);
}

/** Samples from … from+count−1 of a run; what one worker thread computes. */
export function monteCarloBlock(
  input: ReconstructInput,
  options: ReconstructOptions,
  fittedExpected: readonly number[],
  seed: number,
  from: number,
  count: number,
  target: Target | null,
): SampleBlock {
  const problem = prepareProblem(input, options);
  const metrics = Object.fromEntries(METRIC_NAMES.map((n) => [n, [] as number[]])) as Record<MetricName, number[]>;
  const rhoRe: number[][] = [];
  const rhoIm: number[][] = [];
  let failed = 0;
  const d = problem.model.dimension;
  for (const rng of randomStreams(seed, from, count)) {
    const data = resample(problem, fittedExpected, rng);
    try {
      const sigma = solveProblem(problem, data, options).sigma;
      const rho = hermitianPart(scale(sigma, 1 / traceRe(sigma)));
      const f = figuresOfMerit(rho, target);
      const values: Record<MetricName, number | null> = { ...f, phaseOptimisedFidelity: f.phaseOptimised?.fidelity ?? null };
      for (const n of METRIC_NAMES) metrics[n].push(values[n] ?? NaN);
      rhoRe.push(Array.from(rho.re));
      rhoIm.push(Array.from(rho.im));
    } catch (e) {
      if (!(e instanceof EngineInputError)) throw e;
      failed++;
      for (const n of METRIC_NAMES) metrics[n].push(NaN);
      rhoRe.push(new Array(d * d).fill(NaN));
      rhoIm.push(new Array(d * d).fill(NaN));
    }
  }
  return { from, metrics, rhoRe, rhoIm, failed };
}

function resample(problem: PreparedProblem, fitted: readonly number[], rng: { uniform(): number }): PreparedCounts {
  const base = problem.data;
  const k = base.counts.length;
  const counts = new Float64Array(k);
  const clippedRows: number[] = [];
  let total = 0;
  for (let i = 0; i < k; i++) {
    const a = base.accidentals ? base.accidentals[i] : 0;
    const raw = poisson(Math.max(0, fitted[i]) + a, rng);
    const corrected = raw - a;
    if (corrected < 0) clippedRows.push(i);
    counts[i] = Math.max(0, corrected);
    total += counts[i];
  }
  return { ...base, counts, clippedRows, totalCounts: total };
}

/** Combines blocks (in any order) into standard deviations; identical to a one-block run. */
export function summariseMonteCarlo(blocks: SampleBlock[], seed: number, method: string): MonteCarloResult {
  const ordered = [...blocks].sort((a, b) => a.from - b.from);
  const all = <T>(pick: (b: SampleBlock) => T[]) => ordered.flatMap(pick);
  const samples = ordered.reduce((s, b) => s + b.rhoRe.length, 0);
  const failed = ordered.reduce((s, b) => s + b.failed, 0);
  const std = {} as Record<MetricName, number | null>;
  const mean = {} as Record<MetricName, number | null>;
  for (const n of METRIC_NAMES) {
    const stats = meanAndStd(all((b) => b.metrics[n]));
    std[n] = stats?.std ?? null;
    mean[n] = stats?.mean ?? null;
  }
  const re = all((b) => b.rhoRe);
  const im = all((b) => b.rhoIm);
  const size = re[0]?.length ?? 0;
  const d = Math.round(Math.sqrt(size));
  const entry = (rows: number[][], idx: number) => meanAndStd(rows.map((r) => r[idx]))?.std ?? NaN;
  const rho: DensityMatrix = {
    re: Array.from({ length: d }, (_, i) => Array.from({ length: d }, (_, j) => entry(re, i * d + j))),
    im: Array.from({ length: d }, (_, i) => Array.from({ length: d }, (_, j) => entry(im, i * d + j))),
  };
  return { seed, samples, method, failed, std: { ...std, rho }, mean };
}

/** Mean and sample standard deviation (n − 1) of the finite values; null if fewer than two. */
function meanAndStd(values: number[]): { mean: number; std: number } | null {
  const finite = values.filter((v) => Number.isFinite(v));
  if (finite.length < 2) return null;
  const mean = finite.reduce((a, b) => a + b, 0) / finite.length;
  const variance = finite.reduce((a, b) => a + (b - mean) ** 2, 0) / (finite.length - 1);
  return { mean, std: Math.sqrt(variance) };
}
