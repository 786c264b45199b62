/**
 * Maximum likelihood on the Poisson likelihood over positive semidefinite σ (physics contract
 * §4): minimise NLL(σ) = Σ_k [μ_k − n_k ln μ_k], μ_k = w_k ⟨ψ_k|σ|ψ_k⟩.
 *
 * 1. Newton on the convex NLL over all Hermitian σ (unconstrainedPoisson.ts), from the
 *    projected least-squares estimate. If that optimum is positive, it is the answer.
 * 2. Otherwise, and to confirm it, Newton in the Cholesky parametrisation σ = U T T† U† of
 *    James, Kwiat, Munro, White, Phys. Rev. A 64, 052312 (2001), §IV (T lower triangular with
 *    real diagonal), in the eigenbasis U of step 1's result, where the start is T = √Λ. Columns
 *    of T for eigenvalues that step 1 found negative start and stay at zero (the likely face of
 *    the cone). If the certificate below then fails, all columns are freed and the search
 *    goes on. Newton details: poissonNewton.ts, linalg/dampedNewton.ts.
 *
 * Stopping rule — a certificate. NLL is convex in σ and its optimum lies on
 * S = {σ ⪰ 0 : Tr(Mσ) = N}, M = Σ_k w_k P_k, N = Σ_k n_k (scaling σ by s changes NLL by
 * s·Σμ − N ln s, minimal at Σμ = N). Minimising the linearisation over S gives, for every σ,
 *   NLL(σ) − NLL* ≤ (Σμ − N) − N · λ_min(M^{-1/2} G M^{-1/2}),  G = Σ_k (1 − n_k/μ_k) w_k P_k
 * (the first-order convexity bound, e.g. Boyd & Vandenberghe, "Convex Optimization", §3.1.3).
 * This `optimalityGap` (nats of log-likelihood) must fall to tolerance · max(N, 1).
 */
import { inBasis, type MeasurementModel } from "./measurementModel";
import type { PreparedCounts } from "./corrections";
import type { LinearSystem } from "./linearInversion";
import { type CMatrix, add, hermitianPart, identity, multiply, adjoint, scale } from "./linalg/complexMatrix";
import { hermitianEigen } from "./linalg/hermitianEigen";
import { DampedNewton } from "./linalg/dampedNewton";
import { expectedCounts, inverseSqrtTotalOperator, logLikelihood, optimalityGap, rescaled } from "./likelihood";
import { sigmaFromParameters } from "./choleskyParametrisation";
import { PoissonNewton } from "./poissonNewton";
import { UnconstrainedPoisson } from "./unconstrainedPoisson";
import { fromPauliCoefficients, pauliCoefficients } from "./pauliBasis";

/** Default relative tolerance on the optimality gap (nats per count). */
export const MLE_TOLERANCE = 1e-10;
const MAX_ITERATIONS = 200;
/** Fraction of the maximally mixed state mixed into the start so that it is positive definite. */
const START_MIXING = 0.01;
/** Eigenvalues of the step-1 optimum below this fraction of the largest start on the face's boundary. */
const FACE_THRESHOLD = 1e-9;
/** Check the gap once a step lowered NLL by less than this multiple of the threshold. */
const GAP_CHECK_FACTOR = 10;
/** Steps lowering NLL by less than this multiple of the threshold have reached rounding level. */
const STALL_FACTOR = 1e-6;

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
  start: CMatrix,
  options: MleOptions = {},
): MleResult {
  const tolerance = options.tolerance ?? MLE_TOLERANCE;
  const threshold = tolerance * Math.max(data.totalCounts, 1);
  const budget = { left: options.maxIterations ?? MAX_ITERATIONS };
  const mInvSqrt = inverseSqrtTotalOperator(model, data.weights);
  const mixed = fullRankStart(model, data, start);
  let sigma = unconstrainedOptimum(linear, data, mixed, threshold, budget) ?? mixed;
  let search = positiveSearch(model, data, mInvSqrt, sigma, threshold, budget, true);
  if (search.gap > threshold && search.rank < model.dimension && budget.left > 0) {
    const d = model.dimension;
    const opened = add(scale(search.sigma, 1 - START_MIXING), identity(d), (START_MIXING * traceOf(search.sigma)) / d);
    search = positiveSearch(model, data, mInvSqrt, opened, threshold, budget, false);
  }
  sigma = rescaled(model, data, search.sigma);
  const gap = optimalityGap(model, data, sigma, mInvSqrt);
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
 * Newton over T in the eigenbasis of `start`; with `onFace`, columns of eigenvalues below
 * FACE_THRESHOLD·λ_max stay zero. Returns σ in the original basis and the gap reached.
 */
function positiveSearch(
  model: MeasurementModel,
  data: PreparedCounts,
  mInvSqrt: CMatrix,
  start: CMatrix,
  threshold: number,
  budget: { left: number },
  onFace: boolean,
) {
  const d = model.dimension;
  const { values, vectors: u } = hermitianEigen(hermitianPart(start));
  const floor = FACE_THRESHOLD * values[0];
  const rank = onFace ? Math.max(1, values.filter((v) => v > floor).length) : d;
  const rotated = inBasis(model, u);
  const rotatedInvSqrt = multiply(multiply(adjoint(u), mInvSqrt), u);
  const problem = new PoissonNewton(rotated, data, rank);
  const newton = new DampedNewton(problem);
  const theta = new Float64Array(d * d);
  for (let i = 0; i < d; i++) theta[i * i + 2 * i] = i < rank ? Math.sqrt(Math.max(values[i], floor)) : 0;
  let gap = Infinity;
  let lastDecrease = Infinity;
  for (;;) {
    problem.evaluate(theta);
    // The certificate costs an eigen-decomposition; ask for it only once steps have become small.
    // A failed certificate after steps at rounding level means this face is the wrong one.
    if (lastDecrease <= GAP_CHECK_FACTOR * threshold) {
      gap = problem.gap(rotatedInvSqrt);
      if (gap <= threshold || lastDecrease <= STALL_FACTOR * threshold) break;
    }
    const step = budget.left > 0 ? newton.step(theta) : null;
    if (!step) {
      gap = problem.gap(rotatedInvSqrt);
      break;
    }
    budget.left--;
    lastDecrease = step.decrease;
  }
  const sigma = multiply(multiply(u, sigmaFromParameters(theta, d)), adjoint(u));
  return { sigma, gap, rank };
}

/**
 * Newton on the convex likelihood over all Hermitian σ (unconstrainedPoisson.ts) from a
 * positive start; null when some row has no counts (the problem is then unbounded).
 */
function unconstrainedOptimum(linear: LinearSystem, data: PreparedCounts, start: CMatrix, threshold: number, budget: { left: number }): CMatrix | null {
  for (let k = 0; k < data.counts.length; k++) if (!(data.counts[k] > 0)) return null;
  const problem = new UnconstrainedPoisson(linear, data);
  const newton = new DampedNewton(problem);
  const x = pauliCoefficients(start, linear.photons);
  while (budget.left > 0 && problem.evaluate(x)) {
    const step = newton.step(x);
    if (!step) break;
    budget.left--;
    if (step.decrease <= threshold) break;
  }
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
