/**
 * Two-photon states the demo data is generated from (invented data, physics contract §1:
 * basis order HH, HV, VH, VV, photon A first).
 */
import type { DensityMatrix } from "@shared/physics/types";

const zeros = (): number[][] => Array.from({ length: 4 }, () => [0, 0, 0, 0]);

/**
 * p·|ψ(φ)⟩⟨ψ(φ)| + (1 − p)·I/4 with ψ(φ) = (|HV⟩ + e^{iφ}|VH⟩)/√2: φ = π is ψ⁻, and at
 * φ = π this is the Werner state (Werner, Phys. Rev. A 40, 4277 (1989)) with F(ψ⁻) = (1 + 3p)/4.
 */
export function wernerLike(p: number, phaseRad = Math.PI): DensityMatrix {
  const re = zeros();
  const im = zeros();
  for (let i = 0; i < 4; i++) re[i][i] = (1 - p) / 4;
  re[1][1] += p / 2;
  re[2][2] += p / 2;
  // ⟨HV|ρ|VH⟩ = (p/2)·e^{−iφ}
  re[1][2] = (p / 2) * Math.cos(phaseRad);
  im[1][2] = -(p / 2) * Math.sin(phaseRad);
  re[2][1] = re[1][2];
  im[2][1] = -im[1][2];
  return { re, im: im.map((row) => row.map((x) => x + 0)) };
}
