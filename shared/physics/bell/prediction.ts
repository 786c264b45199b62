/**
 * What a two-qubit density matrix predicts for a CHSH test.
 *
 * With T_ij = Tr(ρ σ_i ⊗ σ_j) (i, j ∈ {x, y, z}) and a linear polariser at θ, whose ±1
 * observable is |θ⟩⟨θ| − |θ⊥⟩⟨θ⊥| = sin 2θ σ_x + cos 2θ σ_z, the correlation is
 * E(α, β) = Σ_ij u_i(α) T_ij u_j(β) with u(θ) = (sin 2θ, 0, cos 2θ) (standard; e.g.
 * Horodecki, Horodecki, Horodecki, Phys. Lett. A 200, 340 (1995), Eq. (2) with unit
 * vectors in the x–z plane). The best value over all analysers (any unit vectors) is the
 * Horodecki maximum 2√(m₁ + m₂), m₁ ≥ m₂ the two largest eigenvalues of TᵀT (same paper).
 */
import { type CMatrix, fromPlain, zeros } from "../linalg/complexMatrix";
import { hermitianEigenvalues } from "../linalg/hermitianEigen";
import { pauliCoefficients } from "../pauliBasis";
import type { DensityMatrix } from "../types";
import { type BellAngles, type SettingPairName, settingPairs } from "./angles";

/** T_ij = Tr(ρ σ_i ⊗ σ_j), i, j = x, y, z, as a row-major 3×3 array. */
export function correlationTensor(rho: DensityMatrix | CMatrix): number[][] {
  const m = "n" in rho ? rho : fromPlain(rho);
  if (m.n !== 4) throw new Error(`a two-photon density matrix is 4×4; this one is ${m.n}×${m.n}`);
  const x = pauliCoefficients(m, 2);
  const trace = x[0];
  return [1, 2, 3].map((i) => [1, 2, 3].map((j) => x[i * 4 + j] / trace));
}

function polariserBloch(thetaDeg: number): [number, number, number] {
  const t = (2 * thetaDeg * Math.PI) / 180;
  return [Math.sin(t), 0, Math.cos(t)];
}

/** E(α, β) that ρ predicts for linear polarisers at α (arm A) and β (arm B). */
export function predictedCorrelation(rho: DensityMatrix | CMatrix, alphaDeg: number, betaDeg: number): number {
  return correlationFromTensor(correlationTensor(rho), alphaDeg, betaDeg);
}

function correlationFromTensor(t: number[][], alphaDeg: number, betaDeg: number): number {
  const u = polariserBloch(alphaDeg);
  const v = polariserBloch(betaDeg);
  let e = 0;
  for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) e += u[i] * t[i][j] * v[j];
  return e;
}

export interface PredictedChsh {
  correlations: { name: SettingPairName; alphaDeg: number; betaDeg: number; value: number }[];
  s: number;
  /** Horodecki maximum over all analyser settings. */
  maximum: number;
}

/** S that ρ predicts at the given angles, and the best S any analysers could reach. */
export function predictedChsh(rho: DensityMatrix | CMatrix, angles: BellAngles): PredictedChsh {
  const t = correlationTensor(rho);
  const pairs = settingPairs(angles);
  const correlations = pairs.map((p) => ({
    name: p.name,
    alphaDeg: p.alphaDeg,
    betaDeg: p.betaDeg,
    value: correlationFromTensor(t, p.alphaDeg, p.betaDeg),
  }));
  const s = correlations.reduce((sum, c, i) => sum + pairs[i].sign * c.value, 0);
  return { correlations, s, maximum: horodeckiMaximum(t) };
}

/**
 * 2√(m₁ + m₂) from the correlation tensor (Horodecki et al. 1995), m₁ ≥ m₂ the two largest
 * eigenvalues of TᵀT. Our Jacobi solver, not ml-matrix's EVD: that one throws on subnormal
 * entries and never returns on a NaN.
 */
export function horodeckiMaximum(t: number[][]): number {
  const m = zeros(3);
  for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) for (let k = 0; k < 3; k++) m.re[i * 3 + j] += t[k][i] * t[k][j];
  const ev = hermitianEigenvalues(m);
  return 2 * Math.sqrt(Math.max(0, ev[0] + ev[1]));
}
