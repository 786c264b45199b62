/**
 * Two-qubit entanglement measures (physics contract §6).
 */
import { complexEigenvalues } from "./linalg/complexEigenvalues";
import { type CMatrix, conjugate, multiply, zeros } from "./linalg/complexMatrix";
import { hermitianEigenvalues, hermitianFunction } from "./linalg/hermitianEigen";
import { correlationTensor, horodeckiMaximum } from "./bell/prediction";

/** σ_y ⊗ σ_y in the basis HH, HV, VH, VV (real: anti-diagonal −1, 1, 1, −1). */
function yy(): CMatrix {
  const m = zeros(4);
  m.re[0 * 4 + 3] = -1;
  m.re[1 * 4 + 2] = 1;
  m.re[2 * 4 + 1] = 1;
  m.re[3 * 4 + 0] = -1;
  return m;
}

/**
 * Wootters concurrence, Phys. Rev. Lett. 80, 2245 (1998): C = max(0, λ1 − λ2 − λ3 − λ4), λ the
 * decreasing square roots of the eigenvalues of ρ ρ̃, ρ̃ = (σ_y⊗σ_y) ρ* (σ_y⊗σ_y).
 *
 * Physical ρ: the λ_i are the singular values of B = √ρ (σ_y⊗σ_y) √ρ*, obtained as the
 * non-negative eigenvalues of the Hermitian [[0, B], [B†, 0]] — no square root of a tiny
 * eigenvalue, so C is accurate to rounding. Non-physical ρ (√ρ undefined): the general
 * eigenvalues of ρρ̃ (our bounded Hessenberg-QR solver; ml-matrix's EVD can loop forever);
 * we use √max(0, Re λ). Flagged upstream.
 */
export function concurrence(rho: CMatrix, physical: boolean): number {
  const lambda = physical ? woottersPhysical(rho) : woottersGeneral(rho);
  return Math.max(0, lambda[0] - lambda[1] - lambda[2] - lambda[3]);
}

function woottersPhysical(rho: CMatrix): number[] {
  const root = hermitianFunction(rho, (l) => Math.sqrt(Math.max(0, l)));
  const b = multiply(multiply(root, yy()), conjugate(root));
  const block = zeros(8);
  for (let i = 0; i < 4; i++) {
    for (let j = 0; j < 4; j++) {
      block.re[i * 8 + 4 + j] = b.re[i * 4 + j];
      block.im[i * 8 + 4 + j] = b.im[i * 4 + j];
      block.re[(4 + j) * 8 + i] = b.re[i * 4 + j];
      block.im[(4 + j) * 8 + i] = -b.im[i * 4 + j];
    }
  }
  return Array.from(hermitianEigenvalues(block).subarray(0, 4), (x) => Math.max(0, x));
}

function woottersGeneral(rho: CMatrix): number[] {
  const z = multiply(rho, multiply(multiply(yy(), conjugate(rho)), yy()));
  const parts = complexEigenvalues(z).map((v) => v.re).sort((a, b) => b - a);
  return parts.map((x) => Math.sqrt(Math.max(0, x)));
}

/** ρ^{T_B} for a bipartition into dimA × dimB (photon A first). */
export function partialTranspose(rho: CMatrix, dimA: number): CMatrix {
  const n = rho.n;
  const dimB = n / dimA;
  const out = zeros(n);
  for (let a = 0; a < dimA; a++) {
    for (let b = 0; b < dimB; b++) {
      for (let a2 = 0; a2 < dimA; a2++) {
        for (let b2 = 0; b2 < dimB; b2++) {
          const from = (a * dimB + b2) * n + (a2 * dimB + b);
          const to = (a * dimB + b) * n + (a2 * dimB + b2);
          out.re[to] = rho.re[from];
          out.im[to] = rho.im[from];
        }
      }
    }
  }
  return out;
}

/**
 * Negativity: the sum of |negative eigenvalues| of ρ^{T_B} (Vidal & Werner, Phys. Rev. A 65,
 * 032314 (2002), Eq. (3): N = (‖ρ^{T_A}‖₁ − 1)/2, which equals this sum for Tr ρ = 1).
 */
export function negativity(rho: CMatrix, dimA = 2): number {
  let s = 0;
  for (const l of hermitianEigenvalues(partialTranspose(rho, dimA))) if (l < 0) s -= l;
  return s;
}

/**
 * The largest CHSH value over all analyser settings, 2√(m1 + m2), m1 ≥ m2 the two largest
 * eigenvalues of TᵀT with T_ij = Tr(ρ σ_i⊗σ_j) (Horodecki, Horodecki, Horodecki, Phys. Lett.
 * A 200, 340 (1995)).
 */
export function chshMaximum(rho: CMatrix): number {
  return horodeckiMaximum(correlationTensor(rho));
}
