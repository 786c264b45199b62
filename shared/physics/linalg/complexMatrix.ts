/**
 * Square complex matrices on split typed arrays (row-major `re`, `im`).
 *
 * Why our own and not complex.js/ml-matrix: the likelihood and eigen-solver loops run
 * millions of complex multiply-adds per reconstruction; one object per complex number
 * (complex.js) or real-only matrices (ml-matrix) measured 10–100× slower than flat
 * Float64Arrays. complex.js is kept for parsing and printing single numbers.
 */
import type { DensityMatrix } from "../types";

export interface CMatrix {
  readonly n: number;
  readonly re: Float64Array;
  readonly im: Float64Array;
}

export interface CVector {
  readonly re: Float64Array;
  readonly im: Float64Array;
}

export function zeros(n: number): CMatrix {
  // One allocation for both parts: typed-array allocation dominates for 4×4 matrices.
  const buffer = new Float64Array(2 * n * n);
  return { n, re: buffer.subarray(0, n * n), im: buffer.subarray(n * n) };
}

export function identity(n: number): CMatrix {
  const m = zeros(n);
  for (let i = 0; i < n; i++) m.re[i * n + i] = 1;
  return m;
}

export function copy(a: CMatrix): CMatrix {
  const out = zeros(a.n);
  out.re.set(a.re);
  out.im.set(a.im);
  return out;
}

export function fromPlain(m: DensityMatrix): CMatrix {
  const n = m.re.length;
  const out = zeros(n);
  for (let i = 0; i < n; i++) {
    if (m.re[i].length !== n || m.im[i]?.length !== n) {
      throw new Error(`matrix row ${i + 1} has the wrong length (expected ${n} entries)`);
    }
    for (let j = 0; j < n; j++) {
      out.re[i * n + j] = m.re[i][j];
      out.im[i * n + j] = m.im[i][j];
    }
  }
  return out;
}

export function toPlain(a: CMatrix): DensityMatrix {
  const re: number[][] = [];
  const im: number[][] = [];
  for (let i = 0; i < a.n; i++) {
    re.push(Array.from(a.re.subarray(i * a.n, (i + 1) * a.n)));
    // `+ 0` turns −0 into 0 so that JSON output is tidy.
    im.push(Array.from(a.im.subarray(i * a.n, (i + 1) * a.n), (x) => x + 0));
  }
  return { re, im };
}

export function multiply(a: CMatrix, b: CMatrix): CMatrix {
  const n = a.n;
  const out = zeros(n);
  for (let i = 0; i < n; i++) {
    for (let k = 0; k < n; k++) {
      const ar = a.re[i * n + k];
      const ai = a.im[i * n + k];
      if (ar === 0 && ai === 0) continue;
      for (let j = 0; j < n; j++) {
        const br = b.re[k * n + j];
        const bi = b.im[k * n + j];
        out.re[i * n + j] += ar * br - ai * bi;
        out.im[i * n + j] += ar * bi + ai * br;
      }
    }
  }
  return out;
}

export function adjoint(a: CMatrix): CMatrix {
  const n = a.n;
  const out = zeros(n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      out.re[j * n + i] = a.re[i * n + j];
      out.im[j * n + i] = -a.im[i * n + j];
    }
  }
  return out;
}

export function conjugate(a: CMatrix): CMatrix {
  return { n: a.n, re: a.re.slice(), im: a.im.map((x) => -x) };
}

export function add(a: CMatrix, b: CMatrix, scaleB = 1): CMatrix {
  const out = copy(a);
  for (let i = 0; i < a.re.length; i++) {
    out.re[i] += scaleB * b.re[i];
    out.im[i] += scaleB * b.im[i];
  }
  return out;
}

export function scale(a: CMatrix, s: number): CMatrix {
  const out = zeros(a.n);
  for (let i = 0; i < a.re.length; i++) {
    out.re[i] = a.re[i] * s;
    out.im[i] = a.im[i] * s;
  }
  return out;
}

/** Real part of the trace (the imaginary part of a Hermitian matrix's trace is zero). */
export function traceRe(a: CMatrix): number {
  let t = 0;
  for (let i = 0; i < a.n; i++) t += a.re[i * a.n + i];
  return t;
}

/** Re Tr(A·B) without forming the product. */
export function traceProductRe(a: CMatrix, b: CMatrix): number {
  const n = a.n;
  let t = 0;
  for (let i = 0; i < n; i++) {
    for (let k = 0; k < n; k++) {
      t += a.re[i * n + k] * b.re[k * n + i] - a.im[i * n + k] * b.im[k * n + i];
    }
  }
  return t;
}

export function kron(a: CMatrix, b: CMatrix): CMatrix {
  const n = a.n * b.n;
  const out = zeros(n);
  for (let i = 0; i < a.n; i++) {
    for (let j = 0; j < a.n; j++) {
      const ar = a.re[i * a.n + j];
      const ai = a.im[i * a.n + j];
      for (let k = 0; k < b.n; k++) {
        for (let l = 0; l < b.n; l++) {
          const br = b.re[k * b.n + l];
          const bi = b.im[k * b.n + l];
          const idx = (i * b.n + k) * n + (j * b.n + l);
          out.re[idx] = ar * br - ai * bi;
          out.im[idx] = ar * bi + ai * br;
        }
      }
    }
  }
  return out;
}

/** Tensor product of vectors, first factor most significant (photon A first). */
export function kronVectors(vs: readonly CVector[]): CVector {
  let re = Float64Array.of(1);
  let im = Float64Array.of(0);
  for (const v of vs) {
    const m = v.re.length;
    const nr = new Float64Array(re.length * m);
    const ni = new Float64Array(re.length * m);
    for (let i = 0; i < re.length; i++) {
      for (let j = 0; j < m; j++) {
        nr[i * m + j] = re[i] * v.re[j] - im[i] * v.im[j];
        ni[i * m + j] = re[i] * v.im[j] + im[i] * v.re[j];
      }
    }
    re = nr;
    im = ni;
  }
  return { re, im };
}

/** |v⟩⟨v| */
export function outer(v: CVector): CMatrix {
  const n = v.re.length;
  const out = zeros(n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      out.re[i * n + j] = v.re[i] * v.re[j] + v.im[i] * v.im[j];
      out.im[i * n + j] = v.im[i] * v.re[j] - v.re[i] * v.im[j];
    }
  }
  return out;
}

/** ⟨v|A|v⟩ (real part; exact for Hermitian A). */
export function expectation(a: CMatrix, v: CVector): number {
  const n = a.n;
  let s = 0;
  for (let i = 0; i < n; i++) {
    let wr = 0;
    let wi = 0;
    for (let j = 0; j < n; j++) {
      wr += a.re[i * n + j] * v.re[j] - a.im[i * n + j] * v.im[j];
      wi += a.re[i * n + j] * v.im[j] + a.im[i * n + j] * v.re[j];
    }
    s += v.re[i] * wr + v.im[i] * wi;
  }
  return s;
}

/** (A + A†)/2: removes rounding asymmetry before an eigen-decomposition. */
export function hermitianPart(a: CMatrix): CMatrix {
  const n = a.n;
  const out = zeros(n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      out.re[i * n + j] = 0.5 * (a.re[i * n + j] + a.re[j * n + i]);
      out.im[i * n + j] = 0.5 * (a.im[i * n + j] - a.im[j * n + i]);
    }
  }
  return out;
}

export function maxAbsDifference(a: CMatrix, b: CMatrix): number {
  let m = 0;
  for (let i = 0; i < a.re.length; i++) {
    m = Math.max(m, Math.hypot(a.re[i] - b.re[i], a.im[i] - b.im[i]));
  }
  return m;
}
