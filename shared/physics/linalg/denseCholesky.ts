/**
 * In-place Cholesky factorisation and solve for a symmetric positive definite matrix
 * (Golub & Van Loan, "Matrix Computations", 4th ed., Alg. 4.2.1). Allocation-free: it runs
 * once per damped Newton attempt. For rank decisions use pivotedCholesky instead.
 */

/** Overwrites the lower triangle of `a` (row-major n×n) with L; false if a is not positive definite. */
export function choleskyInPlace(a: Float64Array, n: number): boolean {
  for (let j = 0; j < n; j++) {
    const rj = j * n;
    let diag = a[rj + j];
    for (let k = 0; k < j; k++) diag -= a[rj + k] * a[rj + k];
    if (!(diag > 0)) return false;
    const ljj = Math.sqrt(diag);
    a[rj + j] = ljj;
    const inv = 1 / ljj;
    for (let i = j + 1; i < n; i++) {
      const ri = i * n;
      let s = a[ri + j];
      for (let k = 0; k < j; k++) s -= a[ri + k] * a[rj + k];
      a[ri + j] = s * inv;
    }
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
