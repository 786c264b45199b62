/**
 * Fringe fit: coincidence rate against the analyser angle θ of one arm,
 *   r(θ) = C₀ [1 + V cos(2(θ − θ₀))] + B
 * (physics contract §7, common practice). Expected counts of row k: μ_k = t_k · r(θ_k).
 *
 * Identifiability (our decision): a fringe of period 180° determines only its mean, its
 * amplitude and its phase, so C₀ and B cannot both be fitted — any split of the mean between
 * them fits equally well. B is therefore an input, not a fit parameter: zero (V is then the
 * visibility of the raw fringe), a measured dark or background rate, or the accidental rate
 * s_a·s_b·τ per row (common practice, no single source). Its stated uncertainty is propagated.
 *
 * Method: with B fixed the model is linear in β = (C₀, C₀V cos 2θ₀, C₀V sin 2θ₀), so no
 * nonlinear solver is needed (hence no Levenberg–Marquardt package): we solve the weighted
 * least-squares normal equations with ml-matrix, with Poisson weights 1/μ_k re-evaluated at
 * each step. For a Poisson model with identity link this iteratively reweighted least squares
 * is Fisher scoring and converges to the maximum-likelihood fit (McCullagh & Nelder,
 * "Generalized Linear Models", 2nd ed. (1989), §2.5). Cov(β) = (XᵀWX)⁻¹ at convergence is the
 * inverse Fisher information; V, θ₀ and their uncertainties follow by first-order
 * propagation. Weights use max(μ_k, ½) so a row whose fitted mean nears zero cannot take all
 * the weight (our choice); noiseless data are still fitted exactly.
 */
import { Matrix, inverse } from "ml-matrix";
import { EngineInputError } from "../errors";

export interface FringePoint {
  /** Analyser angle of the scanned arm, degrees (polariser angle). */
  angleDeg: number;
  counts: number;
  /** Exposure in seconds (default 1). */
  seconds?: number;
  /** Expected background counts in this row (e.g. accidentals); overrides the rate below. */
  backgroundCounts?: number;
}

export interface FringeFitOptions {
  /** Background rate B in counts per second (default 0), used for rows without backgroundCounts. */
  backgroundRate?: number;
  /** Standard uncertainty of B (counts per second), propagated into C₀ and V. */
  backgroundRateSigma?: number;
}

export interface FringeFit {
  /** Fringe mean above background, counts per second. */
  c0: number;
  sigmaC0: number;
  visibility: number;
  sigmaVisibility: number;
  /** Angle of the fringe maximum in (−90°, 90°]. */
  phaseDeg: number;
  sigmaPhaseDeg: number;
  /** Mean background rate used, counts per second. */
  backgroundRate: number;
  /** Pearson χ² = Σ (n − μ)²/μ and its degrees of freedom (rows − 3). */
  chiSquare: number;
  degreesOfFreedom: number;
  iterations: number;
  converged: boolean;
}

export const FRINGE_FIT_TOLERANCE = 1e-12;
const MAX_ITERATIONS = 100;
const WEIGHT_FLOOR = 0.5;
const DEG = Math.PI / 180;

/** Fits V, θ₀ and C₀ to the points (method in the file header). */
export function fitFringe(points: readonly FringePoint[], options: FringeFitOptions = {}): FringeFit {
  points.forEach(checkPoint);
  checkSpread(points);
  const rate = options.backgroundRate ?? 0;
  if (!(rate >= 0)) throw new EngineInputError("invalid_input", "backgroundRate must be a number ≥ 0");
  const t = points.map((p) => p.seconds ?? 1);
  const background = points.map((p, k) => p.backgroundCounts ?? rate * t[k]);
  const design = points.map((p, k) => [t[k], t[k] * Math.cos(2 * p.angleDeg * DEG), t[k] * Math.sin(2 * p.angleDeg * DEG)]);
  const target = points.map((p, k) => p.counts - background[k]);

  let weights = points.map((p) => 1 / Math.max(p.counts, WEIGHT_FLOOR));
  let beta = weightedSolve(design, target, weights).beta;
  let iterations = 0;
  let converged = false;
  while (iterations < MAX_ITERATIONS && !converged) {
    iterations++;
    weights = design.map((x, k) => 1 / Math.max(dot(x, beta) + background[k], WEIGHT_FLOOR));
    const next = weightedSolve(design, target, weights).beta;
    const change = Math.max(...next.map((b, i) => Math.abs(b - beta[i])));
    converged = change <= FRINGE_FIT_TOLERANCE * Math.max(1, Math.abs(next[0]));
    beta = next;
  }
  weights = design.map((x, k) => 1 / Math.max(dot(x, beta) + background[k], WEIGHT_FLOOR));
  const { covariance } = weightedSolve(design, target, weights);
  return { ...summarise(beta, covariance, points, design, background, t, options.backgroundRateSigma ?? 0), iterations, converged };
}

function summarise(
  beta: number[],
  cov: number[][],
  points: readonly FringePoint[],
  design: number[][],
  background: number[],
  t: number[],
  sigmaB: number,
): Omit<FringeFit, "iterations" | "converged"> {
  const [c0, b, c] = beta;
  if (!(c0 > 0)) throw new EngineInputError("no_counts", "the fitted fringe mean is not above the background; check the counts and the background rate");
  const amp = Math.hypot(b, c);
  const visibility = amp / c0;
  // Gradients of V = √(b² + c²)/C₀ and θ₀ = ½ atan2(c, b) with respect to (C₀, b, c).
  const gV = amp > 0 ? [-amp / c0 ** 2, b / (c0 * amp), c / (c0 * amp)] : [0, 0, 0];
  const gPhase = amp > 0 ? [0, -c / (2 * amp ** 2), b / (2 * amp ** 2)] : [0, 0, 0];
  // A shift δ of B moves the fitted C₀ by −δ (the mean regressor), so ∂C₀/∂B = −1, ∂V/∂B = V/C₀.
  const varV = quadratic(gV, cov) + (visibility / c0) ** 2 * sigmaB ** 2;
  const mu = design.map((x, k) => dot(x, beta) + background[k]);
  const chiSquare = points.reduce((s, p, k) => s + (p.counts - mu[k]) ** 2 / Math.max(mu[k], WEIGHT_FLOOR), 0);
  const totalT = t.reduce((s, x) => s + x, 0);
  return {
    c0,
    sigmaC0: Math.sqrt(cov[0][0] + sigmaB ** 2),
    visibility,
    sigmaVisibility: Math.sqrt(varV),
    phaseDeg: wrapPhase(Math.atan2(c, b) / 2 / DEG),
    sigmaPhaseDeg: Math.sqrt(quadratic(gPhase, cov)) / DEG,
    backgroundRate: background.reduce((s, x) => s + x, 0) / totalT,
    chiSquare,
    degreesOfFreedom: points.length - 3,
  };
}

function weightedSolve(x: number[][], y: number[], w: number[]): { beta: number[]; covariance: number[][] } {
  const xm = new Matrix(x);
  const xtw = xm.transpose().mulRowVector(w);
  const normal = xtw.mmul(xm);
  const covariance = inverse(normal);
  const beta = covariance.mmul(xtw.mmul(Matrix.columnVector(y))).getColumn(0);
  return { beta, covariance: covariance.to2DArray() };
}

function dot(a: number[], b: number[]): number {
  return a.reduce((s, x, i) => s + x * b[i], 0);
}

function quadratic(g: number[], m: number[][]): number {
  let s = 0;
  for (let i = 0; i < g.length; i++) for (let j = 0; j < g.length; j++) s += g[i] * m[i][j] * g[j];
  return Math.max(0, s);
}

function wrapPhase(deg: number): number {
  let a = ((deg % 180) + 180) % 180;
  if (a > 90) a -= 180;
  return a;
}

function checkPoint(p: FringePoint, i: number): void {
  const where = `row ${i + 1}`;
  if (!Number.isFinite(p.angleDeg)) throw new EngineInputError("invalid_input", `${where}: the analyser angle must be a number`);
  if (!(Number.isFinite(p.counts) && p.counts >= 0)) throw new EngineInputError("invalid_input", `${where}: counts must be a number ≥ 0`);
  if (p.seconds !== undefined && !(p.seconds > 0)) throw new EngineInputError("invalid_input", `${where}: seconds must be a number > 0`);
  if (p.backgroundCounts !== undefined && !(p.backgroundCounts >= 0)) throw new EngineInputError("invalid_input", `${where}: background counts must be ≥ 0`);
}

/** Three distinct angles (modulo 180°) determine the three fringe parameters. */
function checkSpread(points: readonly FringePoint[]): void {
  const distinct = new Set(points.map((p) => Math.round((((p.angleDeg % 180) + 180) % 180) * 1e6)));
  if (distinct.size < 3) {
    throw new EngineInputError("invalid_input", `a fringe fit needs counts at 3 or more different analyser angles (modulo 180°); these rows have ${distinct.size}`);
  }
}

/** The fitted rate r(θ) = C₀[1 + V cos 2(θ − θ₀)] + B (counts per second), e.g. to draw the curve. */
export function fringeModelRate(fit: Pick<FringeFit, "c0" | "visibility" | "phaseDeg" | "backgroundRate">, thetaDeg: number): number {
  return fit.c0 * (1 + fit.visibility * Math.cos(2 * (thetaDeg - fit.phaseDeg) * DEG)) + fit.backgroundRate;
}
