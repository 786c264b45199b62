/**
 * One Levenberg–Marquardt-damped Newton step: solve (H + λ·h̄·I) δ = −g, h̄ the mean Hessian
 * diagonal, and accept when the exact change of the objective is negative. The damping
 * follows the gain ratio ϱ = actual / predicted decrease as in Madsen, Nielsen, Tingleff,
 * "Methods for Non-Linear Least Squares Problems", 2nd ed. (DTU 2004), Eq. (2.21):
 * λ ← λ·max(1/10, 1 − (2ϱ − 1)³) on success, λ ← λ·ν, ν ← 2ν on failure.
 */
import { choleskyInPlace, choleskySolveInPlace } from "./denseCholesky";

export interface NewtonProblem {
  readonly size: number;
  readonly gradient: Float64Array;
  readonly hessian: Float64Array;
  buildHessian(): void;
  /** Exact f(θ + δ) − f(θ) at the last evaluated θ. */
  change(delta: Float64Array): number;
}

export interface NewtonStep {
  damping: number;
  /** Actual decrease of f achieved by the step. */
  decrease: number;
}

const MAX_ATTEMPTS = 40;
const MIN_DAMPING = 1e-12;
const FASTEST_DECREASE = 0.1;

export class DampedNewton {
  private readonly shifted: Float64Array;
  private readonly delta: Float64Array;
  private readonly rhs: Float64Array;

  constructor(private readonly problem: NewtonProblem) {
    const n = problem.size;
    this.shifted = new Float64Array(n * n);
    this.delta = new Float64Array(n);
    this.rhs = new Float64Array(n);
  }

  /** Updates θ in place; null when no step lowers f at double precision. */
  step(theta: Float64Array, damping: number): NewtonStep | null {
    const { problem, shifted, delta, rhs } = this;
    const n = problem.size;
    problem.buildHessian();
    const h = problem.hessian;
    const g = problem.gradient;
    let meanDiag = 0;
    for (let i = 0; i < n; i++) {
      meanDiag += h[i * n + i];
      rhs[i] = -g[i];
    }
    meanDiag = Math.max(meanDiag / n, 1e-300);
    let lambda = damping;
    let nu = 2;
    for (let attempt = 0; attempt < MAX_ATTEMPTS; attempt++) {
      shifted.set(h);
      for (let i = 0; i < n; i++) shifted[i * n + i] += lambda * meanDiag;
      if (choleskyInPlace(shifted, n)) {
        choleskySolveInPlace(shifted, n, rhs, delta);
        const predicted = predictedDecrease(h, g, delta, n);
        if (!(predicted > 0)) return null;
        const actual = -problem.change(delta);
        if (actual > 0) {
          for (let i = 0; i < n; i++) theta[i] += delta[i];
          const ratio = actual / predicted;
          return { damping: Math.max(MIN_DAMPING, lambda * Math.max(FASTEST_DECREASE, 1 - (2 * ratio - 1) ** 3)), decrease: actual };
        }
      }
      lambda *= nu;
      nu *= 2;
    }
    return null;
  }
}

/** −(gᵀδ + ½ δᵀHδ) for the full symmetric H. */
function predictedDecrease(h: Float64Array, g: Float64Array, delta: Float64Array, n: number): number {
  let p = 0;
  for (let i = 0; i < n; i++) {
    let hd = 0;
    const ri = i * n;
    for (let j = 0; j < n; j++) hd += h[ri + j] * delta[j];
    p -= g[i] * delta[i] + 0.5 * delta[i] * hd;
  }
  return p;
}
