/**
 * Maximum likelihood on the Poisson likelihood over positive semidefinite σ (physics contract
 * §4), in the Cholesky parametrisation σ = T T† of James, Kwiat, Munro, White, Phys. Rev. A 64,
 * 052312 (2001), §IV (T lower triangular with real diagonal: d² real parameters θ).
 *
 * Optimiser: Newton's method with the exact Hessian and Levenberg–Marquardt damping
 * (Nocedal & Wright, "Numerical Optimization", 2nd ed., §4 and §10.3). With μ_k = w_k ‖T†ψ_k‖²:
 *   ∂NLL/∂T* = G T,  G = Σ_k c_k w_k |ψ_k⟩⟨ψ_k|,  c_k = 1 − n_k/μ_k,
 *   ∇²NLL = Σ_k (n_k/μ_k²) ∇μ_k ∇μ_kᵀ + ∇²_θ Tr(T† G T)  (c_k held fixed in the second term).
 * Steps are accepted on the exact change of NLL, computed from the change of each μ_k (a
 * quadratic in the step), so progress is not blocked by rounding of NLL itself (~1e-16·|NLL|).
 *
 * Stopping rule — a certificate. NLL is convex in σ and its optimum lies on
 * S = {σ ⪰ 0 : Tr(Mσ) = N}, M = Σ_k w_k P_k, N = Σ_k n_k (scaling σ by s changes NLL by
 * s·Σμ − N ln s, minimal at Σμ = N). Minimising the linearisation over S gives, for every σ,
 *   NLL(σ) − NLL* ≤ (Σμ − N) − N · λ_min(M^{-1/2} G M^{-1/2})
 * (the first-order convexity bound, e.g. Boyd & Vandenberghe, "Convex Optimization", §3.1.3).
 * This `optimalityGap` (nats of log-likelihood) must fall to tolerance · max(N, 1).
 */
import type { MeasurementModel } from "./measurementModel";
import type { PreparedCounts } from "./corrections";
import { type CMatrix, identity, add, scale } from "./linalg/complexMatrix";
import { expectedCounts, gapBound, inverseSqrtTotalOperator, logLikelihood, weightedProjectorSum } from "./likelihood";
import { choleskyParameters, sigmaFromParameters } from "./choleskyParametrisation";
import { PoissonNewton } from "./poissonNewton";
import { DampedNewton } from "./linalg/dampedNewton";

/** Default relative tolerance on the optimality gap (nats per count). */
export const MLE_TOLERANCE = 1e-10;
const MAX_ITERATIONS = 200;
const INITIAL_DAMPING = 1e-6;
/** Check the gap once a step lowered NLL by less than this multiple of the threshold. */
const GAP_CHECK_FACTOR = 10;
/** Fraction of the maximally mixed state mixed into the start so that T has full rank. */
const START_MIXING = 0.01;

export interface MleOptions {
  tolerance?: number;
  maxIterations?: number;
}

export interface MleResult {
  sigma: CMatrix;
  logLikelihood: number;
  iterations: number;
  converged: boolean;
  /** Upper bound on L* − L at the returned σ, in nats. */
  optimalityGap: number;
  /** Relative tolerance used; the absolute threshold is tolerance · max(N, 1). */
  tolerance: number;
}

export function maximumLikelihood(model: MeasurementModel, data: PreparedCounts, start: CMatrix, options: MleOptions = {}): MleResult {
  const tolerance = options.tolerance ?? MLE_TOLERANCE;
  const threshold = tolerance * Math.max(data.totalCounts, 1);
  const mInvSqrt = inverseSqrtTotalOperator(model, data.weights);
  const problem = new PoissonNewton(model, data);
  const theta = choleskyParameters(fullRankStart(model, data, start));
  const maxIterations = options.maxIterations ?? MAX_ITERATIONS;

  const newton = new DampedNewton(problem);
  let iterations = 0;
  let damping = INITIAL_DAMPING;
  let lastDecrease = Infinity;
  for (; iterations < maxIterations; iterations++) {
    problem.evaluate(theta);
    // The certificate costs an eigen-decomposition; ask for it only once steps have become small.
    if (lastDecrease <= GAP_CHECK_FACTOR * threshold && problem.gap(mInvSqrt) <= threshold) break;
    const step = newton.step(theta, damping);
    if (!step) break;
    damping = step.damping;
    lastDecrease = step.decrease;
  }
  const sigma = rescaled(model, data, sigmaFromParameters(theta, model.dimension));
  const gap = optimalityGap(model, data, sigma, mInvSqrt);
  return {
    sigma,
    logLikelihood: logLikelihood(data.counts, expectedCounts(model, data.weights, sigma)),
    iterations,
    converged: gap <= threshold,
    optimalityGap: gap,
    tolerance,
  };
}

/** The bound (Σμ − N) − N λ_min(M^{-1/2} G M^{-1/2}) described above. */
export function optimalityGap(model: MeasurementModel, data: PreparedCounts, sigma: CMatrix, mInvSqrt: CMatrix): number {
  const mu = expectedCounts(model, data.weights, sigma);
  const c = new Float64Array(model.rows);
  let total = 0;
  for (let k = 0; k < model.rows; k++) {
    total += mu[k];
    const nk = data.counts[k];
    if (nk > 0 && !(mu[k] > 0)) return Infinity;
    c[k] = nk > 0 ? 1 - nk / mu[k] : 1;
  }
  return gapBound(weightedProjectorSum(model, c), mInvSqrt, total, data.totalCounts);
}

/** s·σ with s = N / Σμ, the best multiple of σ. */
export function rescaled(model: MeasurementModel, data: PreparedCounts, sigma: CMatrix): CMatrix {
  const total = expectedCounts(model, data.weights, sigma).reduce((a, b) => a + b, 0);
  return total > 0 ? scale(sigma, data.totalCounts / total) : sigma;
}

function fullRankStart(model: MeasurementModel, data: PreparedCounts, start: CMatrix): CMatrix {
  const d = model.dimension;
  let t = 0;
  for (let i = 0; i < d; i++) t += start.re[i * d + i];
  const unit = t > 0 ? scale(start, 1 / t) : identity(d);
  return rescaled(model, data, add(scale(unit, 1 - START_MIXING), identity(d), START_MIXING / d));
}
