/**
 * Maximum likelihood on the Poisson likelihood over positive semidefinite σ (physics contract
 * §4): minimise NLL(σ) = Σ_k [μ_k − n_k ln μ_k], μ_k = w_k ⟨ψ_k|σ|ψ_k⟩.
 *
 * 1. Newton on the convex NLL over all Hermitian σ (unconstrainedPoisson.ts), from the linear
 *    or the projected estimate. If that optimum is positive, it is the answer.
 * 2. Otherwise, and to confirm it, Newton in the Cholesky parametrisation σ = U T T† U† of
 *    James, Kwiat, Munro, White, Phys. Rev. A 64, 052312 (2001), §IV (T lower triangular with
 *    real diagonal), in the eigenbasis U of the current estimate, where the start is T = √Λ.
 *    Columns of T for eigenvalues ≤ 0 (step 1 found them negative) stay at zero: the search runs
 *    on a face of the cone. Every few steps it re-bases in the new eigenbasis, dropping
 *    directions whose eigenvalue has fallen to zero and adding the directions outside the
 *    support along which the likelihood rises (negative eigenvalues of M^{-1/2} G M^{-1/2}
 *    below); on a face where Newton has converged but the certificate fails, all such
 *    directions are added. Newton details: poissonNewton.ts, linalg/dampedNewton.ts.
 *
 * Stopping rule — a certificate. NLL is convex in σ and its optimum lies on
 * S = {σ ⪰ 0 : Tr(Mσ) = N}, M = Σ_k w_k P_k, N = Σ_k n_k (scaling σ by s changes NLL by
 * s·Σμ − N ln s, minimal at Σμ = N). Minimising the linearisation over S gives, for every σ,
 *   NLL(σ) − NLL* ≤ (Σμ − N) − N · λ_min(M^{-1/2} G M^{-1/2}),  G = Σ_k (1 − n_k/μ_k) w_k P_k
 * (the first-order convexity bound, e.g. Boyd & Vandenberghe, "Convex Optimization", §3.1.3).
 * This `optimalityGap` (nats of log-likelihood) must fall to tolerance · max(N, 1).
 */
import { inBasisInto, type MeasurementModel } from "./measurementModel";
import type { PreparedCounts } from "./corrections";
import type { LinearSystem } from "./linearInversion";
import { type CMatrix, add, hermitianPart, identity, multiply, adjoint, scale } from "./linalg/complexMatrix";
import { fromSpectrum, hermitianEigen } from "./linalg/hermitianEigen";
import { DampedNewton } from "./linalg/dampedNewton";
import { expectedCounts, gapBound, gradientOperator, inverseSqrtTotalOperator, logLikelihood, rescaled } from "./likelihood";
import { sigmaFromParameters } from "./choleskyParametrisation";
import { type AnalysedStates, PoissonNewton } from "./poissonNewton";
import { UnconstrainedPoisson } from "./unconstrainedPoisson";
import { fromPauliCoefficients, pauliCoefficients } from "./pauliBasis";

/** Default relative tolerance on the optimality gap (nats per count). */
export const MLE_TOLERANCE = 1e-10;
const MAX_ITERATIONS = 200;
/** Fraction of the maximally mixed state mixed into the start so that it is positive definite. */
const START_MIXING = 0.01;
/** Weight given to new directions when a face is widened, relative to Tr σ. */
const WIDENING = 1e-3;
/** Eigenvalues of the step-1 optimum below this fraction of the largest start on the face's boundary. */
const FACE_THRESHOLD = 1e-9;
/**
 * The unconstrained Newton stops once a step lowers NLL by less than this multiple of the
 * threshold: one more (cheap, quadratically convergent) step than the gap needs, so that an
 * interior optimum passes the certificate without a step in the Cholesky parameters.
 */
const UNCONSTRAINED_STOP = 1e-3;
/** Check the gap once a step lowered NLL by less than this multiple of the threshold. */
const GAP_CHECK_FACTOR = 10;
/** Steps lowering NLL by less than this multiple of the threshold have reached rounding level. */
const STALL_FACTOR = 1e-6;
/**
 * Newton steps in one eigenbasis before re-basing. A re-basing costs a few d×d eigen-
 * decompositions: little next to a Newton step for three or four photons (where re-basing
 * halved the steps of hard cases), as much as two Newton steps for one or two photons.
 */
const stepsPerBasis = (d: number) => (d >= 8 ? 3 : 12);
/** Bound on re-basings, so that a search that cannot move still ends. */
const MAX_REBASES = MAX_ITERATIONS;

export interface MleOptions {
  tolerance?: number;
  maxIterations?: number;
}

export interface MleResult {
  sigma: CMatrix;
  logLikelihood: number;
  /** Newton steps of both stages. */
  iterations: number;
  converged: boolean;
  /** Upper bound on L* − L at the returned σ, in nats. */
  optimalityGap: number;
  /** Relative tolerance used; the absolute threshold is tolerance · max(N, 1). */
  tolerance: number;
}

export function maximumLikelihood(
  model: MeasurementModel,
  linear: LinearSystem,
  data: PreparedCounts,
  starts: { linear: CMatrix; positive: () => CMatrix },
  options: MleOptions = {},
): MleResult {
  const tolerance = options.tolerance ?? MLE_TOLERANCE;
  const threshold = tolerance * Math.max(data.totalCounts, 1);
  const budget = { left: options.maxIterations ?? MAX_ITERATIONS };
  const mInvSqrt = inverseSqrtTotalOperator(model, data.weights);
  // A positive definite start, needed only when the linear estimate has some μ_k ≤ 0.
  const mixed = () => fullRankStart(model, data, starts.positive());
  let sigma = unconstrainedOptimum(workspace(model), linear, data, [() => starts.linear, mixed], threshold, budget) ?? mixed();
  let search = positiveSearch(model, data, mInvSqrt, sigma, threshold, budget);
  for (let rebases = 0; search.gap > threshold && budget.left > 0 && rebases < MAX_REBASES; rebases++) {
    // Re-base in the current eigenbasis every few steps (directions that went to zero leave the
    // face); a face on which Newton has converged but the certificate fails is widened along the
    // directions that would raise the likelihood.
    if (search.stalled && search.rank === model.dimension) break;
    const next = search.rank < model.dimension ? widened(model, data, search.sigma, mInvSqrt, !search.stalled) : search.sigma;
    search = positiveSearch(model, data, mInvSqrt, next, threshold, budget);
  }
  // Rescaling to Σμ = N only lowers NLL, so the gap bound of search.sigma holds for it as well.
  sigma = rescaled(model, data, search.sigma);
  const gap = search.gap;
  return {
    sigma,
    logLikelihood: logLikelihood(data.counts, expectedCounts(model, data.weights, sigma)),
    iterations: (options.maxIterations ?? MAX_ITERATIONS) - budget.left,
    converged: gap <= threshold,
    optimalityGap: gap,
    tolerance,
  };
}

/**
 * The solver's buffers for one shape (dimension and number of rows), reused by every
 * reconstruction of that shape: typed arrays above 64 bytes live outside the V8 heap and cost
 * microseconds each to allocate and collect, as much as a Newton step of a two-photon problem.
 * Only scratch lives here; results never point into it.
 */
interface Workspace {
  rotated: AnalysedStates;
  face: PoissonNewton | null;
  faceNewton: DampedNewton | null;
  theta: Float64Array;
  unconstrained: UnconstrainedPoisson | null;
  unconstrainedNewton: DampedNewton | null;
}

/** Shapes kept (the oldest is dropped beyond this). */
const MAX_WORKSPACES = 6;
const workspaces = new Map<string, Workspace>();

function workspace(model: MeasurementModel): Workspace {
  const d = model.dimension;
  const key = `${d}:${model.rows}`;
  let w = workspaces.get(key);
  if (!w) {
    const rotated = { dimension: d, rows: model.rows, psiRe: new Float64Array(model.rows * d), psiIm: new Float64Array(model.rows * d) };
    w = { rotated, face: null, faceNewton: null, theta: new Float64Array(d * d), unconstrained: null, unconstrainedNewton: null };
    if (workspaces.size >= MAX_WORKSPACES) workspaces.delete(workspaces.keys().next().value!);
    workspaces.set(key, w);
  }
  return w;
}

/**
 * Newton over T in the eigenbasis of `start`; columns of eigenvalues below FACE_THRESHOLD·λ_max
 * stay zero. Returns σ in the original basis and the gap reached.
 */
function positiveSearch(
  model: MeasurementModel,
  data: PreparedCounts,
  mInvSqrt: CMatrix,
  start: CMatrix,
  threshold: number,
  budget: { left: number },
) {
  const d = model.dimension;
  const { values, vectors: u } = hermitianEigen(hermitianPart(start));
  const floor = FACE_THRESHOLD * values[0];
  let rank = 0;
  for (let i = 0; i < d; i++) if (values[i] > floor) rank++;
  rank = Math.max(1, rank);
  const work = workspace(model);
  const { rotated, theta } = work;
  inBasisInto(model, u, rotated);
  const rotatedInvSqrt = multiply(multiply(adjoint(u), mInvSqrt), u);
  if (work.face) work.face.reset(rotated, data, rank);
  else work.face = new PoissonNewton(rotated, data, rank);
  const problem = work.face;
  work.faceNewton ??= new DampedNewton(problem);
  const newton = work.faceNewton;
  // Start at the positive part of `start`, scaled to the measured total (the best multiple).
  theta.fill(0);
  let total = 0;
  for (let k = 0; k < model.rows; k++) {
    let s = 0;
    for (let i = 0; i < rank; i++) {
      const v = Math.max(values[i], floor);
      const pr = rotated.psiRe[k * d + i], pi = rotated.psiIm[k * d + i];
      s += pr * (v * pr) + pi * (v * pi);
    }
    total += data.weights[k] * s;
  }
  const scaleToTotal = data.totalCounts / total;
  for (let i = 0; i < rank; i++) theta[i * i + 2 * i] = Math.sqrt(Math.max(values[i], floor) * scaleToTotal);
  const gapHere = () => gapBound(problem.g, rotatedInvSqrt, problem.totalExpected, data.totalCounts);
  let gap = Infinity;
  let lastDecrease = Infinity;
  let stalled = false;
  for (let steps = 0; ; steps++) {
    problem.evaluate(theta);
    // The certificate costs an eigen-decomposition; ask for it at the start (step 1 may already
    // have found the optimum) and once steps have become small. A failed certificate after
    // steps at rounding level means this face is the wrong one.
    if (steps === 0 || lastDecrease <= GAP_CHECK_FACTOR * threshold) {
      gap = gapHere();
      stalled = lastDecrease <= STALL_FACTOR * threshold;
      if (gap <= threshold || stalled) break;
    }
    const step = steps < stepsPerBasis(d) && budget.left > 0 ? newton.step(theta) : null;
    if (!step) {
      if (steps < stepsPerBasis(d)) stalled = true;
      gap = gapHere();
      break;
    }
    budget.left--;
    lastDecrease = step.decrease;
  }
  const sigma = multiply(multiply(u, sigmaFromParameters(theta, d)), adjoint(u));
  return { sigma, gap, rank, stalled };
}

/**
 * σ plus a little weight along every direction in which the linearised NLL decreases: the
 * eigenvectors w of M^{-1/2} G M^{-1/2} with negative eigenvalues, mapped to M^{-1/2} w (the
 * minimisers of the linearisation over S, see the certificate above).
 */
function widened(model: MeasurementModel, data: PreparedCounts, sigma: CMatrix, mInvSqrt: CMatrix, outsideOnly: boolean): CMatrix {
  const d = model.dimension;
  const { values, vectors } = hermitianEigen(multiply(multiply(mInvSqrt, gradientOperator(model, data, sigma)), mInvSqrt));
  const mapped = multiply(mInvSqrt, vectors);
  const support = hermitianEigen(hermitianPart(sigma));
  const floor = FACE_THRESHOLD * support.values[0];
  const directions = values.map((v, col) => (v < 0 && (!outsideOnly || outsideFraction(mapped, col, support, floor) > 0.5) ? 1 : 0));
  if (!directions.some((x) => x)) return sigma;
  const added = multiply(multiply(mInvSqrt, fromSpectrum(vectors, directions)), mInvSqrt);
  const weight = (WIDENING * traceOf(sigma)) / Math.max(1, traceOf(added));
  return add(sigma, added, weight);
}

/** Share of column `col` of `y` outside the span of the eigenvectors of σ above `floor`. */
function outsideFraction(y: CMatrix, col: number, support: { values: Float64Array; vectors: CMatrix }, floor: number): number {
  const d = y.n;
  let total = 0;
  let inside = 0;
  for (let i = 0; i < d; i++) total += y.re[i * d + col] ** 2 + y.im[i * d + col] ** 2;
  for (let k = 0; k < d; k++) {
    if (!(support.values[k] > floor)) continue;
    let re = 0;
    let im = 0;
    for (let i = 0; i < d; i++) {
      const vr = support.vectors.re[i * d + k], vi = support.vectors.im[i * d + k];
      re += vr * y.re[i * d + col] + vi * y.im[i * d + col];
      im += vr * y.im[i * d + col] - vi * y.re[i * d + col];
    }
    inside += re * re + im * im;
  }
  return total > 0 ? 1 - inside / total : 0;
}

/**
 * Newton on the convex likelihood over all Hermitian σ (unconstrainedPoisson.ts) from the start
 * with every μ_k > 0 and the lowest NLL (for a square system the linear estimate, which already
 * is the optimum: μ_k = n_k); null when some row has no counts (the problem is then unbounded).
 */
function unconstrainedOptimum(work: Workspace, linear: LinearSystem, data: PreparedCounts, starts: (() => CMatrix)[], threshold: number, budget: { left: number }): CMatrix | null {
  for (let k = 0; k < data.counts.length; k++) if (!(data.counts[k] > 0)) return null;
  if (work.unconstrained) work.unconstrained.reset(linear, data);
  else work.unconstrained = new UnconstrainedPoisson(linear, data);
  const problem = work.unconstrained;
  work.unconstrainedNewton ??= new DampedNewton(problem);
  const newton = work.unconstrainedNewton;
  // The feasible start of lowest NLL (with all counts positive the linear estimate usually is,
  // and for a square system it is the optimum itself, so no other start is tried).
  const square = linear.rows === linear.params;
  let x: Float64Array | null = null;
  let best = Infinity;
  for (const start of starts) {
    const candidate = pauliCoefficients(start(), linear.photons);
    if (!problem.evaluate(candidate)) continue;
    const f = problem.value();
    if (f < best) {
      best = f;
      x = candidate;
    }
    if (square) break;
  }
  if (!x || !problem.evaluate(x)) return null;
  do {
    const step = budget.left > 0 ? newton.step(x) : null;
    if (!step) break;
    budget.left--;
    if (step.decrease <= UNCONSTRAINED_STOP * threshold) break;
  } while (problem.evaluate(x));
  return fromPauliCoefficients(x, linear.photons);
}

function fullRankStart(model: MeasurementModel, data: PreparedCounts, start: CMatrix): CMatrix {
  const d = model.dimension;
  const t = traceOf(start);
  const unit = t > 0 ? scale(start, 1 / t) : identity(d);
  return rescaled(model, data, add(scale(unit, 1 - START_MIXING), identity(d), START_MIXING / d));
}

function traceOf(m: CMatrix): number {
  let t = 0;
  for (let i = 0; i < m.n; i++) t += m.re[i * m.n + i];
  return t;
}
