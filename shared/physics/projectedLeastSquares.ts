/**
 * The closest density matrix (Frobenius norm) to a unit-trace Hermitian estimate:
 * Smolin, Gambetta, Smith, "Efficient method for computing the maximum-likelihood quantum
 * state from measurements with additive Gaussian noise", Phys. Rev. Lett. 108, 070502
 * (2012), the algorithm of their Fig. 1 — sort the eigenvalues, zero the most negative ones
 * and spread their weight evenly over the rest, O(d³) for the eigen-decomposition.
 */
import { type CMatrix, hermitianPart, scale, traceRe } from "./linalg/complexMatrix";
import { fromSpectrum, hermitianEigen } from "./linalg/hermitianEigen";

/** Eigenvalues (descending, summing to 1) → the nearest probability vector, as in Smolin et al. */
export function projectEigenvalues(mu: ArrayLike<number>): Float64Array {
  const d = mu.length;
  const lambda = Float64Array.from(mu);
  let a = 0;
  let i = d;
  while (i > 0 && lambda[i - 1] + a / i < 0) {
    a += lambda[i - 1];
    lambda[i - 1] = 0;
    i--;
  }
  for (let j = 0; j < i; j++) lambda[j] += a / i;
  return lambda;
}

/** ρ_SGS from any Hermitian σ with positive trace. */
export function projectToDensityMatrix(sigma: CMatrix): CMatrix {
  const t = traceRe(sigma);
  if (!(t > 0)) throw new Error("the linear estimate has trace ≤ 0; there are no counts to project");
  const { values, vectors } = hermitianEigen(hermitianPart(scale(sigma, 1 / t)));
  return fromSpectrum(vectors, projectEigenvalues(values));
}
