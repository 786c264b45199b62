/**
 * The Poisson model of the counts (physics contract §3–4): μ_k = w_k ⟨ψ_k|σ|ψ_k⟩ and
 * L(σ) = Σ_k [n_k ln μ_k − μ_k] (without ln n_k!), the negative of the NLL that the MLE minimises.
 */
import type { MeasurementModel } from "./measurementModel";
import { type CMatrix, multiply, scale, zeros } from "./linalg/complexMatrix";
import type { PreparedCounts } from "./corrections";
import { hermitianEigen, hermitianEigenvalues, fromSpectrum } from "./linalg/hermitianEigen";

export function expectedCounts(model: MeasurementModel, weights: Float64Array, sigma: CMatrix): Float64Array {
  const d = model.dimension;
  const mu = new Float64Array(model.rows);
  const { psiRe, psiIm } = model;
  for (let k = 0; k < model.rows; k++) {
    const o = k * d;
    let s = 0;
    for (let i = 0; i < d; i++) {
      let wr = 0;
      let wi = 0;
      for (let j = 0; j < d; j++) {
        const ar = sigma.re[i * d + j], ai = sigma.im[i * d + j];
        wr += ar * psiRe[o + j] - ai * psiIm[o + j];
        wi += ar * psiIm[o + j] + ai * psiRe[o + j];
      }
      s += psiRe[o + i] * wr + psiIm[o + i] * wi;
    }
    mu[k] = weights[k] * s;
  }
  return mu;
}

/** Σ [n ln μ − μ]; −∞ when a row with counts has μ ≤ 0; NaN-free. */
export function logLikelihood(counts: Float64Array, mu: Float64Array): number {
  let l = 0;
  for (let k = 0; k < counts.length; k++) {
    const n = counts[k];
    if (n > 0) {
      if (!(mu[k] > 0)) return -Infinity;
      l += n * Math.log(mu[k]);
    }
    l -= mu[k];
  }
  return l;
}

/** Σ_k c_k w_k |ψ_k⟩⟨ψ_k| for per-row coefficients c_k. */
export function weightedProjectorSum(model: MeasurementModel, coefficients: ArrayLike<number>): CMatrix {
  const d = model.dimension;
  const out = zeros(d);
  const { psiRe, psiIm } = model;
  for (let k = 0; k < model.rows; k++) {
    const c = coefficients[k];
    if (c === 0) continue;
    const o = k * d;
    for (let i = 0; i < d; i++) {
      const xr = c * psiRe[o + i], xi = c * psiIm[o + i];
      for (let j = 0; j < d; j++) {
        out.re[i * d + j] += xr * psiRe[o + j] + xi * psiIm[o + j];
        out.im[i * d + j] += xi * psiRe[o + j] - xr * psiIm[o + j];
      }
    }
  }
  return out;
}

/**
 * M^{-1/2} for M = Σ_k w_k P_k, the operator whose expectation is the total expected count.
 * Positive definite for an informationally complete set.
 */
export function inverseSqrtTotalOperator(model: MeasurementModel, weights: Float64Array): CMatrix {
  const { values, vectors } = hermitianEigen(weightedProjectorSum(model, weights));
  return fromSpectrum(vectors, values.map((v) => 1 / Math.sqrt(v)));
}

/** (Σμ − N) − N λ_min(M^{-1/2} G M^{-1/2}), never negative. */
export function gapBound(g: CMatrix, mInvSqrt: CMatrix, totalExpected: number, totalCounts: number): number {
  const values = hermitianEigenvalues(multiply(multiply(mInvSqrt, g), mInvSqrt));
  return Math.max(0, totalExpected - totalCounts - totalCounts * values[values.length - 1]);
}

/** G = Σ_k (1 − n_k/μ_k) w_k P_k, the gradient of NLL with respect to σ (rows without counts: c_k = 1). */
export function gradientOperator(model: MeasurementModel, data: PreparedCounts, sigma: CMatrix): CMatrix {
  const mu = expectedCounts(model, data.weights, sigma);
  return weightedProjectorSum(model, mu.map((m, k) => (data.counts[k] > 0 ? 1 - data.counts[k] / m : 1)));
}

/** s·σ with s = N / Σμ, the best multiple of σ. */
export function rescaled(model: MeasurementModel, data: PreparedCounts, sigma: CMatrix): CMatrix {
  const total = expectedCounts(model, data.weights, sigma).reduce((a, b) => a + b, 0);
  return total > 0 ? scale(sigma, data.totalCounts / total) : sigma;
}
