/**
 * The Pauli-product basis of Hermitian d×d matrices, d = 2ⁿ: Γ_j = σ_{j1} ⊗ … ⊗ σ_{jn} with
 * σ_0 = I, σ_1 = X, σ_2 = Y, σ_3 = Z, Tr(Γ_i Γ_j) = d δ_ij, so σ = (1/d) Σ_j Tr(σ Γ_j) Γ_j
 * (e.g. James et al., Phys. Rev. A 64, 052312 (2001), Eq. (3.9) for two qubits).
 * Index j has base-4 digits j1 … jn, photon A most significant.
 */
import { type CMatrix, zeros } from "./linalg/complexMatrix";
import { memoByKey } from "./memo";

export const PAULI_LETTERS = ["I", "X", "Y", "Z"] as const;

export function pauliName(j: number, photons: number): string {
  let s = "";
  for (let i = photons - 1; i >= 0; i--) s += PAULI_LETTERS[(j >> (2 * i)) & 3];
  return s;
}

/**
 * Visits the non-zero entries of Γ_j: one per row r, at column r XOR mask, value i^power.
 */
function forEachEntry(j: number, photons: number, visit: (r: number, c: number, re: number, im: number) => void): void {
  const d = 1 << photons;
  let mask = 0;
  for (let q = 0; q < photons; q++) {
    const p = (j >> (2 * (photons - 1 - q))) & 3;
    if (p === 1 || p === 2) mask |= 1 << (photons - 1 - q);
  }
  for (let r = 0; r < d; r++) {
    let power = 0;
    for (let q = 0; q < photons; q++) {
      const p = (j >> (2 * (photons - 1 - q))) & 3;
      const bit = (r >> (photons - 1 - q)) & 1;
      if (p === 2) power += bit ? 1 : 3;
      else if (p === 3 && bit) power += 2;
    }
    power &= 3;
    visit(r, r ^ mask, power === 0 ? 1 : power === 2 ? -1 : 0, power === 1 ? 1 : power === 3 ? -1 : 0);
  }
}

/** Every Γ_j as tables: the entry of row r is re/im[j·d + r] at column[j·d + r]. */
interface PauliEntries {
  column: Int32Array;
  re: Float64Array;
  im: Float64Array;
}

/** The tables, computed once per photon number (they are only read). */
const entriesOf = memoByKey(pauliEntries);

function pauliEntries(photons: number): PauliEntries {
  const d = 1 << photons;
  const column = new Int32Array(d * d * d);
  const re = new Float64Array(d * d * d);
  const im = new Float64Array(d * d * d);
  for (let j = 0; j < d * d; j++) {
    forEachEntry(j, photons, (r, c, vr, vi) => {
      column[j * d + r] = c;
      re[j * d + r] = vr;
      im[j * d + r] = vi;
    });
  }
  return { column, re, im };
}

/** σ = (1/d) Σ_j x_j Γ_j */
export function fromPauliCoefficients(x: ArrayLike<number>, photons: number): CMatrix {
  const d = 1 << photons;
  const out = zeros(d);
  const { column, re, im } = entriesOf(photons);
  for (let j = 0; j < d * d; j++) {
    const xj = x[j] / d;
    if (xj === 0) continue;
    for (let r = 0; r < d; r++) {
      const e = j * d + r;
      out.re[r * d + column[e]] += xj * re[e];
      out.im[r * d + column[e]] += xj * im[e];
    }
  }
  return out;
}

/** x_j = Tr(ρ Γ_j) (real for Hermitian ρ). */
export function pauliCoefficients(rho: CMatrix, photons: number): Float64Array {
  const d = 1 << photons;
  const x = new Float64Array(d * d);
  const { column, re, im } = entriesOf(photons);
  for (let j = 0; j < d * d; j++) {
    // Tr(ρΓ) = Σ_r ρ_{c r} Γ_{r c}, c the column of row r
    let s = 0;
    for (let r = 0; r < d; r++) {
      const e = j * d + r;
      const c = column[e];
      s += rho.re[c * d + r] * re[e] - rho.im[c * d + r] * im[e];
    }
    x[j] = s;
  }
  return x;
}

/**
 * Row of the design matrix for a product projector: a_j = (1/d) Π_i b_i(j_i), where
 * b_i = (1, ⟨X⟩, ⟨Y⟩, ⟨Z⟩) of photon i's analysed state, so that Tr(σ P) = Σ_j a_j Tr(σ Γ_j).
 */
export function designRow(
  singleRe: Float64Array,
  singleIm: Float64Array,
  offset: number,
  photons: number,
  out: Float64Array,
  outOffset: number,
): void {
  const d = 1 << photons;
  // Build the product in place: after photon q the first 4^(q+1) entries hold the partial products.
  out[outOffset] = 1 / d;
  let length = 1;
  for (let q = 0; q < photons; q++) {
    const o = offset + q * 2;
    const ar = singleRe[o], ai = singleIm[o], br = singleRe[o + 1], bi = singleIm[o + 1];
    // Bloch components of (a, b): X = 2 Re(a* b), Y = 2 Im(a* b), Z = |a|² − |b|²
    const b0 = ar * ar + ai * ai + br * br + bi * bi;
    const b1 = 2 * (ar * br + ai * bi);
    const b2 = 2 * (ar * bi - ai * br);
    const b3 = ar * ar + ai * ai - br * br - bi * bi;
    // backwards, so that entry i is read before entries 4i … 4i + 3 overwrite it
    for (let i = length - 1; i >= 0; i--) {
      const v = out[outOffset + i];
      const t = outOffset + 4 * i;
      out[t] = v * b0;
      out[t + 1] = v * b1;
      out[t + 2] = v * b2;
      out[t + 3] = v * b3;
    }
    length *= 4;
  }
}
