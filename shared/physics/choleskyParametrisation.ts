/**
 * σ = T T† with T lower triangular and real, non-negative diagonal: every positive
 * semidefinite σ has this form (James, Kwiat, Munro, White, Phys. Rev. A 64, 052312 (2001),
 * Eq. (4.4)). The d² real parameters are, for each row i of T, the complex entries
 * T_i0 … T_i,i−1 (real part, imaginary part) followed by the real T_ii.
 */
import { type CMatrix, zeros } from "./linalg/complexMatrix";

export function unpackParameters(x: Float64Array, d: number, tRe: Float64Array, tIm: Float64Array): void {
  let p = 0;
  for (let i = 0; i < d; i++) {
    for (let j = 0; j < i; j++) {
      tRe[i * d + j] = x[p++];
      tIm[i * d + j] = x[p++];
    }
    tRe[i * d + i] = x[p++];
    tIm[i * d + i] = 0;
  }
}

export function sigmaFromParameters(x: Float64Array, d: number): CMatrix {
  const t = zeros(d);
  unpackParameters(x, d, t.re as Float64Array, t.im as Float64Array);
  const s = zeros(d);
  for (let i = 0; i < d; i++) {
    for (let j = 0; j < d; j++) {
      let re = 0;
      let im = 0;
      for (let k = 0; k <= Math.min(i, j); k++) {
        // T_ik · conj(T_jk)
        re += t.re[i * d + k] * t.re[j * d + k] + t.im[i * d + k] * t.im[j * d + k];
        im += t.im[i * d + k] * t.re[j * d + k] - t.re[i * d + k] * t.im[j * d + k];
      }
      s.re[i * d + j] = re;
      s.im[i * d + j] = im;
    }
  }
  return s;
}

/** Parameters of the Cholesky factor of a positive definite σ. */
export function choleskyParameters(sigma: CMatrix): Float64Array {
  const d = sigma.n;
  const tr = new Float64Array(d * d);
  const ti = new Float64Array(d * d);
  for (let j = 0; j < d; j++) {
    let diag = sigma.re[j * d + j];
    for (let k = 0; k < j; k++) diag -= tr[j * d + k] ** 2 + ti[j * d + k] ** 2;
    if (!(diag > 0)) throw new Error("internal: the start matrix is not positive definite");
    const tjj = Math.sqrt(diag);
    tr[j * d + j] = tjj;
    for (let i = j + 1; i < d; i++) {
      // T_ij = (σ_ij − Σ_k T_ik conj(T_jk)) / T_jj
      let re = sigma.re[i * d + j];
      let im = sigma.im[i * d + j];
      for (let k = 0; k < j; k++) {
        re -= tr[i * d + k] * tr[j * d + k] + ti[i * d + k] * ti[j * d + k];
        im -= ti[i * d + k] * tr[j * d + k] - tr[i * d + k] * ti[j * d + k];
      }
      tr[i * d + j] = re / tjj;
      ti[i * d + j] = im / tjj;
    }
  }
  const x = new Float64Array(d * d);
  let p = 0;
  for (let i = 0; i < d; i++) {
    for (let j = 0; j < i; j++) {
      x[p++] = tr[i * d + j];
      x[p++] = ti[i * d + j];
    }
    x[p++] = tr[i * d + i];
  }
  return x;
}
