/**
 * The Poisson likelihood over all Hermitian σ (no positivity), in Pauli coordinates x
 * (σ = (1/d) Σ_j x_j Γ_j, see pauliBasis.ts): μ_k = w_k a_kᵀx is linear, so NLL(x) is convex
 * with gradient Σ_k c_k w_k a_k (c_k = 1 − n_k/μ_k) and Hessian Σ_k (n_k/μ_k²) w_k² a_k a_kᵀ.
 * Newton converges quadratically here; its optimum is the maximum-likelihood state whenever
 * that lies inside the cone of positive matrices, and otherwise a good start for the
 * positive-semidefinite search (maximumLikelihood.ts). Only defined when every row has
 * counts (a row with n_k = 0 would let μ_k run to −∞).
 */
import type { PreparedCounts } from "./corrections";
import type { LinearSystem } from "./linearInversion";
import type { LinePoint, NewtonProblem } from "./linalg/dampedNewton";

export class UnconstrainedPoisson implements NewtonProblem {
  readonly size: number;
  readonly gradient: Float64Array;
  readonly hessian: Float64Array;
  private readonly mu: Float64Array;
  private readonly change: Float64Array;
  private wa: Float64Array = new Float64Array(0);
  private linear!: LinearSystem;
  private data!: PreparedCounts;

  constructor(linear: LinearSystem, data: PreparedCounts) {
    const p = linear.params;
    this.size = p;
    this.gradient = new Float64Array(p);
    this.hessian = new Float64Array(p * p);
    this.mu = new Float64Array(linear.rows);
    this.change = new Float64Array(linear.rows);
    this.reset(linear, data);
  }

  /** Another system of the same size (parameters and rows) and other counts: the buffers are reused. */
  reset(linear: LinearSystem, data: PreparedCounts): void {
    if (linear.params !== this.size || linear.rows !== this.mu.length) throw new Error("internal: UnconstrainedPoisson reused for another shape");
    this.linear = linear;
    this.data = data;
    const p = linear.params;
    // w_k a_k, the gradient of μ_k, at the non-zero entries of the design (wa[e] for column nonzero[e])
    const { nonzero, nonzeroStart } = linear;
    if (this.wa.length < nonzero.length) this.wa = new Float64Array(nonzero.length);
    for (let k = 0; k < linear.rows; k++) {
      for (let e = nonzeroStart[k]; e < nonzeroStart[k + 1]; e++) this.wa[e] = linear.design[k * p + nonzero[e]] * data.weights[k];
    }
  }

  /** μ and the gradient at x; false if some μ_k ≤ 0. */
  evaluate(x: Float64Array): boolean {
    const { wa, mu, gradient, data } = this;
    const { nonzero, nonzeroStart } = this.linear;
    gradient.fill(0);
    for (let k = 0; k < this.linear.rows; k++) {
      let m = 0;
      for (let a = nonzeroStart[k]; a < nonzeroStart[k + 1]; a++) m += wa[a] * x[nonzero[a]];
      mu[k] = m;
      if (!(m > 0)) return false;
      const c = 1 - data.counts[k] / m;
      for (let a = nonzeroStart[k]; a < nonzeroStart[k + 1]; a++) gradient[nonzero[a]] += c * wa[a];
    }
    return true;
  }

  /** NLL at the last evaluated point (meaningful only after evaluate() returned true). */
  value(): number {
    let f = 0;
    for (let k = 0; k < this.linear.rows; k++) f += this.mu[k] - this.data.counts[k] * Math.log(this.mu[k]);
    return f;
  }

  buildHessian(): void {
    const { size: p, wa, mu, hessian: h, data } = this;
    const { nonzero, nonzeroStart } = this.linear;
    h.fill(0);
    for (let k = 0; k < this.linear.rows; k++) {
      const s = data.counts[k] / (mu[k] * mu[k]);
      for (let a = nonzeroStart[k]; a < nonzeroStart[k + 1]; a++) {
        const i = nonzero[a];
        const ga = s * wa[a];
        for (let b = nonzeroStart[k]; b <= a; b++) h[i * p + nonzero[b]] += ga * wa[b];
      }
    }
    for (let a = 0; a < p; a++) for (let b = 0; b < a; b++) h[b * p + a] = h[a * p + b];
  }

  setDirection(delta: Float64Array): void {
    const { wa, change } = this;
    const { nonzero, nonzeroStart } = this.linear;
    for (let k = 0; k < this.linear.rows; k++) {
      let m = 0;
      for (let a = nonzeroStart[k]; a < nonzeroStart[k + 1]; a++) m += wa[a] * delta[nonzero[a]];
      change[k] = m;
    }
  }

  along(alpha: number): LinePoint {
    const { mu, change, data } = this;
    let value = 0;
    let slope = 0;
    let curvature = 0;
    for (let k = 0; k < this.linear.rows; k++) {
      const dm = alpha * change[k];
      const rel = dm / mu[k];
      if (!(rel > -1)) return { value: Infinity, slope: NaN, curvature: NaN };
      const m = mu[k] + dm;
      const n = data.counts[k];
      value += dm - n * Math.log1p(rel);
      slope += change[k] * (1 - n / m);
      curvature += (n * change[k] * change[k]) / (m * m);
    }
    return { value, slope, curvature };
  }
}
