/**
 * One step of Newton's method with an exact line search (Nocedal & Wright, "Numerical
 * Optimization", 2nd ed., §3.1 and §3.4): direction δ = −(H + λ h̄ I)⁻¹ g, h̄ the mean Hessian
 * diagonal, with the smallest shift λ ∈ {0, 1e-8, 1e-6, …, 1e4} that makes the matrix positive
 * definite (far from the optimum the Hessian of a non-convex parametrisation can be
 * indefinite); then α minimising f(θ + αδ) by safeguarded one-dimensional Newton steps on
 * exact values and derivatives that the problem supplies.
 */
import { choleskyInPlace, choleskySolveInPlace } from "./denseCholesky";

export interface LinePoint {
  value: number;
  slope: number;
  curvature: number;
}

export interface NewtonProblem {
  readonly size: number;
  readonly gradient: Float64Array;
  readonly hessian: Float64Array;
  /** 1 for parameters that may move; frozen ones (0) keep their value. All free when absent. */
  readonly free?: Uint8Array;
  buildHessian(): void;
  setDirection(delta: Float64Array): void;
  /** f(θ + αδ) − f(θ) and its derivatives in α, at the last evaluated θ and set δ. */
  along(alpha: number): LinePoint;
}

export interface NewtonStep {
  /** Decrease of f achieved by the step (> 0). */
  decrease: number;
  alpha: number;
}

const SHIFTS = [0, 1e-8, 1e-6, 1e-4, 1e-2, 1, 1e2, 1e4];
const LINE_ITERATIONS = 30;
const MAX_ALPHA = 1e3;

export class DampedNewton {
  private readonly shifted: Float64Array;
  private readonly delta: Float64Array;
  private readonly rhs: Float64Array;
  /** Positions of the free parameters, and their part of the right-hand side and the step. */
  private readonly index: Int32Array;
  private readonly rhsFree: Float64Array;
  private readonly deltaFree: Float64Array;

  constructor(private readonly problem: NewtonProblem) {
    const n = problem.size;
    this.shifted = new Float64Array(n * n);
    this.delta = new Float64Array(n);
    this.rhs = new Float64Array(n);
    this.index = new Int32Array(n);
    this.rhsFree = new Float64Array(n);
    this.deltaFree = new Float64Array(n);
  }

  /** Updates θ in place; null when no step lowers f at double precision. */
  step(theta: Float64Array): NewtonStep | null {
    const { problem, delta } = this;
    const n = problem.size;
    problem.buildHessian();
    if (!this.direction()) return null;
    problem.setDirection(delta);
    const alpha = lineMinimum(problem);
    if (alpha === null) return null;
    const decrease = -problem.along(alpha).value;
    if (!(decrease > 0)) return null;
    for (let i = 0; i < n; i++) theta[i] += alpha * delta[i];
    return { decrease, alpha };
  }

  /**
   * Frozen parameters keep δ = 0, so the system is solved on the free ones only (the same
   * numbers as with identity rows for the frozen ones, at (m/n)³ of the cost).
   */
  private direction(): boolean {
    const { problem, shifted, delta, rhs, index, rhsFree, deltaFree } = this;
    const n = problem.size;
    const h = problem.hessian;
    let meanDiag = 0;
    for (let i = 0; i < n; i++) {
      meanDiag += h[i * n + i];
      rhs[i] = -problem.gradient[i];
    }
    meanDiag = Math.max(meanDiag / n, 1e-300);
    const free = problem.free;
    let m = 0;
    for (let i = 0; i < n; i++) if (!free || free[i]) index[m++] = i;
    for (let a = 0; a < m; a++) rhsFree[a] = rhs[index[a]];
    for (const lambda of SHIFTS) {
      for (let a = 0; a < m; a++) {
        const row = index[a] * n;
        for (let b = 0; b < m; b++) shifted[a * m + b] = h[row + index[b]];
        shifted[a * m + a] += lambda * meanDiag;
      }
      if (choleskyInPlace(shifted, m)) {
        choleskySolveInPlace(shifted, m, rhsFree, deltaFree);
        delta.fill(0);
        for (let a = 0; a < m; a++) delta[index[a]] = deltaFree[a];
        return true;
      }
    }
    return false;
  }
}

/** α > 0 with f'(α) ≈ 0 along the set direction, bracketed and safeguarded; null if f'(0) ≥ 0. */
function lineMinimum(problem: NewtonProblem): number | null {
  const start = problem.along(0);
  if (!(start.slope < 0)) return null;
  let lo = 0;
  let hi = Infinity;
  let alpha = 1;
  let best = 0;
  let bestValue = 0;
  for (let it = 0; it < LINE_ITERATIONS; it++) {
    const p = problem.along(alpha);
    if (!Number.isFinite(p.value)) {
      hi = alpha;
      alpha = 0.5 * (lo + alpha);
      continue;
    }
    if (p.value < bestValue) {
      best = alpha;
      bestValue = p.value;
    }
    if (p.slope < 0) lo = alpha;
    else hi = alpha;
    if (Math.abs(p.slope) <= 1e-12 * Math.abs(start.slope)) break;
    let next = p.curvature > 0 ? alpha - p.slope / p.curvature : NaN;
    if (!(next > lo && next < hi)) next = hi === Infinity ? Math.min(2 * alpha, MAX_ALPHA) : 0.5 * (lo + hi);
    if (next === alpha || hi - lo <= 1e-15 * hi) break;
    alpha = next;
  }
  return best > 0 ? best : null;
}
