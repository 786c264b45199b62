/**
 * Cholesky factorisation with diagonal pivoting of a real symmetric positive semidefinite
 * matrix, G = Pᵀ L Lᵀ P (Higham, "Accuracy and Stability of Numerical Algorithms", 2nd ed.,
 * §10.3). It reveals the numerical rank: we stop when the largest remaining pivot drops
 * below `relativeTolerance` × the largest diagonal entry.
 *
 * Why our own: ml-matrix's CholeskyDecomposition does not pivot and only flags exact
 * non-positive pivots, and its SVD took 3 s on the 1296 × 256 four-photon design matrix;
 * this factorisation of the 256 × 256 normal matrix takes a few milliseconds.
 */

export interface PivotedCholesky {
  size: number;
  rank: number;
  /** Row-major lower-triangular factor of the permuted matrix (size × size). */
  factor: Float64Array;
  /** factor row i belongs to original index permutation[i]. */
  permutation: Int32Array;
  /** Smallest accepted pivot over the largest (a conditioning indicator, 0 … 1). */
  pivotRatio: number;
}

export function pivotedCholesky(matrix: Float64Array, size: number, relativeTolerance = 1e-10): PivotedCholesky {
  const a = matrix.slice();
  const perm = Int32Array.from({ length: size }, (_, i) => i);
  let maxDiag = 0;
  for (let i = 0; i < size; i++) maxDiag = Math.max(maxDiag, a[i * size + i]);
  const limit = relativeTolerance * maxDiag;
  let rank = 0;
  let firstPivot = 0;
  let lastPivot = 0;
  for (let k = 0; k < size; k++) {
    let best = k;
    for (let i = k + 1; i < size; i++) if (a[i * size + i] > a[best * size + best]) best = i;
    const pivot = a[best * size + best];
    if (!(pivot > limit)) break;
    if (best !== k) swapSymmetric(a, size, k, best, perm);
    const d = Math.sqrt(pivot);
    if (k === 0) firstPivot = pivot;
    lastPivot = pivot;
    a[k * size + k] = d;
    for (let i = k + 1; i < size; i++) a[i * size + k] /= d;
    for (let j = k + 1; j < size; j++) {
      const ljk = a[j * size + k];
      if (ljk === 0) continue;
      for (let i = j; i < size; i++) a[i * size + j] -= a[i * size + k] * ljk;
    }
    rank++;
  }
  const factor = new Float64Array(size * size);
  for (let i = 0; i < size; i++) for (let j = 0; j <= Math.min(i, rank - 1); j++) factor[i * size + j] = a[i * size + j];
  return { size, rank, factor, permutation: perm, pivotRatio: rank > 0 ? lastPivot / firstPivot : 0 };
}

/**
 * Swaps indices i < j of the symmetric matrix held in the lower triangle, including the
 * factor columns already computed.
 */
function swapSymmetric(a: Float64Array, n: number, i: number, j: number, perm: Int32Array): void {
  const t = perm[i];
  perm[i] = perm[j];
  perm[j] = t;
  for (let k = 0; k < i; k++) swap(a, i * n + k, j * n + k);
  for (let k = i + 1; k < j; k++) swap(a, k * n + i, j * n + k);
  for (let k = j + 1; k < n; k++) swap(a, k * n + i, k * n + j);
  swap(a, i * n + i, j * n + j);
}

function swap(a: Float64Array, x: number, y: number): void {
  const t = a[x];
  a[x] = a[y];
  a[y] = t;
}

/** Solves G x = b for a full-rank factorisation. */
export function choleskySolve(chol: PivotedCholesky, b: Float64Array): Float64Array {
  const n = chol.size;
  if (chol.rank < n) throw new Error("cannot solve with a rank-deficient factorisation");
  const l = chol.factor;
  const y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let s = b[chol.permutation[i]];
    for (let k = 0; k < i; k++) s -= l[i * n + k] * y[k];
    y[i] = s / l[i * n + i];
  }
  for (let i = n - 1; i >= 0; i--) {
    let s = y[i];
    for (let k = i + 1; k < n; k++) s -= l[k * n + i] * y[k];
    y[i] = s / l[i * n + i];
  }
  const x = new Float64Array(n);
  for (let i = 0; i < n; i++) x[chol.permutation[i]] = y[i];
  return x;
}
