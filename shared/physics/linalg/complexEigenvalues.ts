/**
 * Eigenvalues of a general (non-Hermitian) complex square matrix: Householder reduction to
 * upper Hessenberg form, then the shifted QR algorithm with Givens rotations, Wilkinson shifts,
 * deflation and exceptional shifts (Golub & Van Loan, Matrix Computations, 4th ed. (2013),
 * §7.4–7.5; Wilkinson, The Algebraic Eigenvalue Problem (1965), for the shift).
 *
 * Ours rather than ml-matrix's EigenvalueDecomposition because that routine has no iteration
 * bound: on a matrix with a NaN (and some near-degenerate inputs) it never returns, which froze
 * the web process. This one gives up after a fixed number of sweeps and throws.
 */
import type { CMatrix } from "./complexMatrix";

export interface ComplexValue {
  re: number;
  im: number;
}

/**
 * QR sweeps allowed per eigenvalue before giving up: LAPACK's zlahqr allows 30·max(10, n). A
 * near-degenerate complex pair of ρρ̃ (a non-physical estimate) was seen to need 63.
 */
const maxIterationsPerEigenvalue = (n: number) => 30 * Math.max(10, n);

export function complexEigenvalues(a: CMatrix): ComplexValue[] {
  const n = a.n;
  for (let k = 0; k < n * n; k++) {
    if (!Number.isFinite(a.re[k]) || !Number.isFinite(a.im[k])) throw new Error("eigenvalues: the matrix has a non-finite entry");
  }
  const re = Float64Array.from(a.re);
  const im = Float64Array.from(a.im);
  toHessenberg(re, im, n);
  return hessenbergQr(re, im, n);
}

/** In place: A ← Q† A Q with Householder reflections, zeroing below the first subdiagonal. */
function toHessenberg(re: Float64Array, im: Float64Array, n: number): void {
  const vr = new Float64Array(n);
  const vi = new Float64Array(n);
  for (let k = 0; k < n - 2; k++) {
    let norm2 = 0;
    for (let i = k + 1; i < n; i++) norm2 += re[i * n + k] ** 2 + im[i * n + k] ** 2;
    const norm = Math.sqrt(norm2);
    if (norm === 0) continue;
    const x0r = re[(k + 1) * n + k];
    const x0i = im[(k + 1) * n + k];
    const x0abs = Math.hypot(x0r, x0i);
    // alpha = −e^{i arg x0} ‖x‖ avoids cancellation in v = x − alpha e1.
    const pr = x0abs === 0 ? 1 : x0r / x0abs;
    const pi = x0abs === 0 ? 0 : x0i / x0abs;
    vr.fill(0);
    vi.fill(0);
    for (let i = k + 1; i < n; i++) {
      vr[i] = re[i * n + k];
      vi[i] = im[i * n + k];
    }
    vr[k + 1] += pr * norm;
    vi[k + 1] += pi * norm;
    let vnorm2 = 0;
    for (let i = k + 1; i < n; i++) vnorm2 += vr[i] ** 2 + vi[i] ** 2;
    if (vnorm2 === 0) continue;
    const scale = 2 / vnorm2;
    // Left: A ← (I − s v v†) A.
    for (let j = 0; j < n; j++) {
      let sr = 0;
      let si = 0;
      for (let i = k + 1; i < n; i++) {
        sr += vr[i] * re[i * n + j] + vi[i] * im[i * n + j];
        si += vr[i] * im[i * n + j] - vi[i] * re[i * n + j];
      }
      for (let i = k + 1; i < n; i++) {
        re[i * n + j] -= scale * (vr[i] * sr - vi[i] * si);
        im[i * n + j] -= scale * (vr[i] * si + vi[i] * sr);
      }
    }
    // Right: A ← A (I − s v v†).
    for (let i = 0; i < n; i++) {
      let sr = 0;
      let si = 0;
      for (let j = k + 1; j < n; j++) {
        sr += re[i * n + j] * vr[j] - im[i * n + j] * vi[j];
        si += re[i * n + j] * vi[j] + im[i * n + j] * vr[j];
      }
      for (let j = k + 1; j < n; j++) {
        re[i * n + j] -= scale * (sr * vr[j] + si * vi[j]);
        im[i * n + j] -= scale * (si * vr[j] - sr * vi[j]);
      }
    }
  }
}

/** Shifted QR on the active window of an upper Hessenberg matrix until every eigenvalue deflates. */
function hessenbergQr(re: Float64Array, im: Float64Array, n: number): ComplexValue[] {
  const out: ComplexValue[] = [];
  const cs = new Float64Array(n);
  const sr = new Float64Array(n);
  const si = new Float64Array(n);
  // Deflation also relative to the whole matrix (LAPACK's zlahqr does the same): beside tiny
  // eigenvalues the local test alone can wait for a subdiagonal below rounding that never comes.
  let norm = 0;
  for (let k = 0; k < n * n; k++) norm = Math.max(norm, Math.hypot(re[k], im[k]));
  let hi = n - 1;
  let iterations = 0;
  while (hi >= 0) {
    if (hi === 0) {
      out.push({ re: re[0], im: im[0] });
      break;
    }
    // Find the start of the unreduced block ending at hi.
    let lo = hi;
    while (lo > 0) {
      const sub = Math.hypot(re[lo * n + lo - 1], im[lo * n + lo - 1]);
      const diag = Math.hypot(re[lo * n + lo], im[lo * n + lo]) + Math.hypot(re[(lo - 1) * n + lo - 1], im[(lo - 1) * n + lo - 1]);
      if (sub <= Number.EPSILON * (diag || 1) || sub <= Number.EPSILON * norm * 1e-2) {
        re[lo * n + lo - 1] = 0;
        im[lo * n + lo - 1] = 0;
        break;
      }
      lo--;
    }
    if (lo === hi) {
      out.push({ re: re[hi * n + hi], im: im[hi * n + hi] });
      hi--;
      iterations = 0;
      continue;
    }
    if (++iterations > maxIterationsPerEigenvalue(n)) throw new Error("eigenvalues: the QR iteration did not converge");
    const [mr, mi] = iterations % 11 === 0 ? exceptionalShift(re, im, n, hi) : wilkinsonShift(re, im, n, hi);
    for (let k = lo; k <= hi; k++) {
      re[k * n + k] -= mr;
      im[k * n + k] -= mi;
    }
    // R = G_{hi-1} … G_lo (H − μI): rotations chosen to zero each subdiagonal entry.
    for (let k = lo; k < hi; k++) {
      const ar = re[k * n + k];
      const ai = im[k * n + k];
      const br = re[(k + 1) * n + k];
      const bi = im[(k + 1) * n + k];
      const aabs = Math.hypot(ar, ai);
      const r = Math.hypot(aabs, Math.hypot(br, bi));
      let c: number, gr: number, gi: number;
      if (r === 0) {
        c = 1;
        gr = 0;
        gi = 0;
      } else if (aabs === 0) {
        c = 0;
        gr = br / r;
        gi = -bi / r;
      } else {
        c = aabs / r;
        // s = (a/|a|) · conj(b) / r
        const ur = ar / aabs;
        const ui = ai / aabs;
        gr = (ur * br + ui * bi) / r;
        gi = (ui * br - ur * bi) / r;
      }
      cs[k] = c;
      sr[k] = gr;
      si[k] = gi;
      for (let j = k; j < n; j++) {
        const xr = re[k * n + j];
        const xi = im[k * n + j];
        const yr = re[(k + 1) * n + j];
        const yi = im[(k + 1) * n + j];
        // row k ← c x + s y ; row k+1 ← −conj(s) x + c y
        re[k * n + j] = c * xr + (gr * yr - gi * yi);
        im[k * n + j] = c * xi + (gr * yi + gi * yr);
        re[(k + 1) * n + j] = -(gr * xr + gi * xi) + c * yr;
        im[(k + 1) * n + j] = -(gr * xi - gi * xr) + c * yi;
      }
    }
    // H' = R G_lo† … G_{hi-1}† + μI.
    for (let k = lo; k < hi; k++) {
      const c = cs[k];
      const gr = sr[k];
      const gi = si[k];
      for (let i = 0; i <= Math.min(k + 2, hi); i++) {
        const xr = re[i * n + k];
        const xi = im[i * n + k];
        const yr = re[i * n + k + 1];
        const yi = im[i * n + k + 1];
        // col k ← c x + conj(s) y ; col k+1 ← −s x + c y
        re[i * n + k] = c * xr + (gr * yr + gi * yi);
        im[i * n + k] = c * xi + (gr * yi - gi * yr);
        re[i * n + k + 1] = -(gr * xr - gi * xi) + c * yr;
        im[i * n + k + 1] = -(gr * xi + gi * xr) + c * yi;
      }
    }
    for (let k = lo; k <= hi; k++) {
      re[k * n + k] += mr;
      im[k * n + k] += mi;
    }
  }
  return out;
}

/** The eigenvalue of the trailing 2×2 block closer to its last diagonal entry. */
function wilkinsonShift(re: Float64Array, im: Float64Array, n: number, hi: number): [number, number] {
  const a: [number, number] = [re[(hi - 1) * n + hi - 1], im[(hi - 1) * n + hi - 1]];
  const b: [number, number] = [re[(hi - 1) * n + hi], im[(hi - 1) * n + hi]];
  const c: [number, number] = [re[hi * n + hi - 1], im[hi * n + hi - 1]];
  const d: [number, number] = [re[hi * n + hi], im[hi * n + hi]];
  const hr = (a[0] - d[0]) / 2;
  const hiPart = (a[1] - d[1]) / 2;
  // disc = h² + b c
  const dr = hr * hr - hiPart * hiPart + (b[0] * c[0] - b[1] * c[1]);
  const di = 2 * hr * hiPart + (b[0] * c[1] + b[1] * c[0]);
  const [qr, qi] = complexSqrt(dr, di);
  const mid: [number, number] = [(a[0] + d[0]) / 2, (a[1] + d[1]) / 2];
  const p: [number, number] = [mid[0] + qr, mid[1] + qi];
  const m: [number, number] = [mid[0] - qr, mid[1] - qi];
  return Math.hypot(p[0] - d[0], p[1] - d[1]) <= Math.hypot(m[0] - d[0], m[1] - d[1]) ? p : m;
}

/** A shift off the usual one, to break the rare cycles of plain Wilkinson shifts. */
function exceptionalShift(re: Float64Array, im: Float64Array, n: number, hi: number): [number, number] {
  const sub = Math.hypot(re[hi * n + hi - 1], im[hi * n + hi - 1]);
  return [re[hi * n + hi] + 1.5 * sub, im[hi * n + hi] + 0.5 * sub];
}

function complexSqrt(x: number, y: number): [number, number] {
  const r = Math.hypot(x, y);
  const a = Math.sqrt((r + x) / 2);
  const b = Math.sqrt(Math.max(0, (r - x) / 2));
  return [a, y < 0 ? -b : b];
}
