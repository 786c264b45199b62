/**
 * Eigen-decomposition of a Hermitian matrix by the cyclic complex Jacobi method
 * (Jacobi 1846; the threshold strategy of Rutishauser, Numer. Math. 9, 1 (1966), as in
 * Press et al., Numerical Recipes, 3rd ed., §11.1, extended to complex entries by first
 * removing the phase of the pivot element).
 *
 * Why our own: ml-matrix has only real decompositions (a real 2n×2n embedding doubles every
 * eigenvalue and scrambles the eigenvectors of degenerate levels), and mathjs `eigs` on
 * complex matrices is ~100× slower. Jacobi is accurate to a few ulps of ‖A‖ for the
 * 2×2 … 16×16 matrices of one to four photons.
 */
import { type CMatrix, zeros } from "./complexMatrix";
import { memoByKey } from "../memo";

export interface EigenDecomposition {
  /** Eigenvalues in descending order. */
  values: Float64Array;
  /** Eigenvectors as columns, in the order of `values`. */
  vectors: CMatrix;
}

const MAX_SWEEPS = 60;

export function hermitianEigen(input: CMatrix): EigenDecomposition {
  const n = input.n;
  const w = jacobi(input, true);
  const vectors = zeros(n);
  const values = new Float64Array(n);
  for (let col = 0; col < n; col++) {
    const src = w.order[col];
    values[col] = w.ar[src * n + src];
    for (let k = 0; k < n; k++) {
      vectors.re[k * n + col] = w.vr[k * n + src];
      vectors.im[k * n + col] = w.vi[k * n + src];
    }
  }
  return { values, vectors };
}

/** Eigenvalues only, descending (the same values as hermitianEigen, without the eigenvectors' cost). */
export function hermitianEigenvalues(a: CMatrix): Float64Array {
  const n = a.n;
  const w = jacobi(a, false);
  const values = new Float64Array(n);
  for (let col = 0; col < n; col++) values[col] = w.ar[w.order[col] * n + w.order[col]];
  return values;
}

/** Scratch of the Jacobi sweeps, one per size: typed arrays above 64 bytes live off the V8 heap and cost microseconds each to allocate. */
interface JacobiWork {
  ar: Float64Array;
  ai: Float64Array;
  vr: Float64Array;
  vi: Float64Array;
  order: Int32Array;
}

const workFor = memoByKey(
  (n: number): JacobiWork => ({ ar: new Float64Array(n * n), ai: new Float64Array(n * n), vr: new Float64Array(n * n), vi: new Float64Array(n * n), order: new Int32Array(n) }),
);

/** Diagonalises a copy of `input` in the size's scratch; `order` lists the diagonal by descending value. */
function jacobi(input: CMatrix, withVectors: boolean): JacobiWork {
  const n = input.n;
  const w = workFor(n);
  const { ar, ai, vr, vi, order } = w;
  ar.set(input.re);
  ai.set(input.im);
  if (withVectors) {
    vr.fill(0);
    vi.fill(0);
    for (let i = 0; i < n; i++) vr[i * n + i] = 1;
  }
  for (let i = 0; i < n; i++) ai[i * n + i] = 0;

  for (let sweep = 0; sweep < MAX_SWEEPS; sweep++) {
    let off = 0;
    let diag = 0;
    for (let p = 0; p < n; p++) {
      diag += ar[p * n + p] * ar[p * n + p];
      for (let q = p + 1; q < n; q++) off += ar[p * n + q] ** 2 + ai[p * n + q] ** 2;
    }
    // Converged when the off-diagonal norm is below 1e-15 of the total (eigenvalue errors ~ its square).
    if (off === 0 || off <= 1e-30 * (diag + 2 * off)) break;
    const threshold = sweep < 3 ? (0.2 * Math.sqrt(off)) / (n * n) : 0;

    for (let p = 0; p < n - 1; p++) {
      for (let q = p + 1; q < n; q++) {
        const xr = ar[p * n + q];
        const xi = ai[p * n + q];
        // |a_pq| scaled so that tiny entries (down to subnormals) keep a unit phase factor
        const ax = Math.abs(xr);
        const ay = Math.abs(xi);
        const big = ax > ay ? ax : ay;
        const ratio = big === 0 ? 0 : (ax > ay ? ay : ax) / big;
        const r = big * Math.sqrt(1 + ratio * ratio);
        if (r === 0 || r < threshold) continue;
        const app = ar[p * n + p];
        const aqq = ar[q * n + q];
        // Skip elements already negligible next to both diagonal entries (Numerical Recipes).
        if (sweep > 3 && Math.abs(app) + 1e2 * r === Math.abs(app) && Math.abs(aqq) + 1e2 * r === Math.abs(aqq)) {
          ar[p * n + q] = ai[p * n + q] = ar[q * n + p] = ai[q * n + p] = 0;
          continue;
        }
        // U = diag(1, e^{-iφ}) · [[c, s], [-s, c]] on (p, q), with e^{iφ} = a_pq / |a_pq|.
        const er = xr / r;
        const ei = xi / r;
        const theta = (aqq - app) / (2 * r);
        const t = (theta >= 0 ? 1 : -1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
        const c = 1 / Math.sqrt(t * t + 1);
        const s = t * c;
        // Columns: A ← A·U
        for (let k = 0; k < n; k++) {
          const kpr = ar[k * n + p], kpi = ai[k * n + p];
          const kqr = ar[k * n + q], kqi = ai[k * n + q];
          // a_kq · e^{-iφ}
          const wr = kqr * er + kqi * ei;
          const wi = kqi * er - kqr * ei;
          ar[k * n + p] = c * kpr - s * wr;
          ai[k * n + p] = c * kpi - s * wi;
          ar[k * n + q] = s * kpr + c * wr;
          ai[k * n + q] = s * kpi + c * wi;
        }
        if (withVectors) {
          for (let k = 0; k < n; k++) {
            const vpr = vr[k * n + p], vpi = vi[k * n + p];
            const vqr = vr[k * n + q], vqi = vi[k * n + q];
            const ur = vqr * er + vqi * ei;
            const ui = vqi * er - vqr * ei;
            vr[k * n + p] = c * vpr - s * ur;
            vi[k * n + p] = c * vpi - s * ui;
            vr[k * n + q] = s * vpr + c * ur;
            vi[k * n + q] = s * vpi + c * ui;
          }
        }
        // Rows: A ← U†·A
        for (let k = 0; k < n; k++) {
          const pkr = ar[p * n + k], pki = ai[p * n + k];
          const qkr = ar[q * n + k], qki = ai[q * n + k];
          // a_qk · e^{iφ}
          const wr = qkr * er - qki * ei;
          const wi = qki * er + qkr * ei;
          ar[p * n + k] = c * pkr - s * wr;
          ai[p * n + k] = c * pki - s * wi;
          ar[q * n + k] = s * pkr + c * wr;
          ai[q * n + k] = s * pki + c * wi;
        }
        ar[p * n + q] = ai[p * n + q] = ar[q * n + p] = ai[q * n + p] = 0;
        ai[p * n + p] = ai[q * n + q] = 0;
      }
    }
  }
  // Descending order of the diagonal (stable insertion sort, as Array.prototype.sort is).
  for (let i = 0; i < n; i++) {
    let j = i;
    while (j > 0 && ar[order[j - 1] * n + order[j - 1]] < ar[i * n + i]) {
      order[j] = order[j - 1];
      j--;
    }
    order[j] = i;
  }
  return w;
}

/** V · diag(f(λ)) · V† — a function of a Hermitian matrix through its spectrum. */
export function hermitianFunction(a: CMatrix, f: (lambda: number) => number): CMatrix {
  const { values, vectors } = hermitianEigen(a);
  return fromSpectrum(vectors, values.map(f));
}

export function fromSpectrum(vectors: CMatrix, values: ArrayLike<number>): CMatrix {
  const n = vectors.n;
  const out = zeros(n);
  for (let k = 0; k < n; k++) {
    const lambda = values[k];
    if (lambda === 0) continue;
    for (let i = 0; i < n; i++) {
      const air = vectors.re[i * n + k];
      const aii = vectors.im[i * n + k];
      for (let j = 0; j < n; j++) {
        const bjr = vectors.re[j * n + k];
        const bji = vectors.im[j * n + k];
        out.re[i * n + j] += lambda * (air * bjr + aii * bji);
        out.im[i * n + j] += lambda * (aii * bjr - air * bji);
      }
    }
  }
  return out;
}
