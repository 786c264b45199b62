/**
 * Every figure of merit of physics contract §6 for one density matrix. Two-qubit measures are
 * null for other photon numbers. A non-physical ρ (negative eigenvalues, e.g. from linear
 * inversion) still gets numbers, with `physical: false` so that the caller marks them.
 *
 * - purity Tr ρ²; linear entropy d/(d−1)·(1 − Tr ρ²) (4/3 for two qubits, the usual
 *   normalisation in photonic tomography, from memory: 1 for the maximally mixed state);
 * - von Neumann entropy −Σ λ log₂ λ in bits over λ > 0 (von Neumann, "Mathematische
 *   Grundlagen der Quantenmechanik" (1932));
 * - tangle C² (Coffman, Kundu, Wootters, Phys. Rev. A 61, 052306 (2000)).
 */
import type { DensityMatrix, Target } from "./types";
import { type CMatrix, fromPlain, hermitianPart } from "./linalg/complexMatrix";
import { hermitianEigenvalues } from "./linalg/hermitianEigen";
import { fidelityToTarget, phaseOptimisedFidelity, type PhaseOptimisedFidelity } from "./fidelity";
import { chshMaximum, concurrence, negativity } from "./entanglement";
import { predictedChsh } from "./bell/prediction";
import { STANDARD_BELL_ANGLES, type BellAngles } from "./bell/angles";
import { PHYSICAL_TOLERANCE } from "./tolerances";

export interface FiguresOfMerit {
  /** Fidelity to the target (null without one). */
  fidelity: number | null;
  target: string | null;
  concurrence: number | null;
  tangle: number | null;
  purity: number;
  linearEntropy: number;
  vonNeumannEntropy: number;
  negativity: number | null;
  chshMax: number | null;
  eigenvalues: number[];
  physical: boolean;
  /** Best fidelity to (|HV⟩ + e^{iφ}|VH⟩)/√2 or (|HH⟩ + e^{iφ}|VV⟩)/√2 — the family of the target, else the better one. */
  phaseOptimised: PhaseOptimisedFidelity | null;
}

export function figuresOfMerit(rho: DensityMatrix | CMatrix, target: Target | null = "phi+"): FiguresOfMerit {
  const m = hermitianPart("n" in rho ? rho : fromPlain(rho));
  const d = m.n;
  const eigenvalues = Array.from(hermitianEigenvalues(m));
  const physical = eigenvalues[d - 1] >= -PHYSICAL_TOLERANCE;
  let purity = 0;
  for (let i = 0; i < d * d; i++) purity += m.re[i] * m.re[i] + m.im[i] * m.im[i];
  let entropy = 0;
  for (const l of eigenvalues) if (l > 0) entropy -= l * Math.log2(l);
  const twoQubit = d === 4;
  const c = twoQubit ? concurrence(m, physical) : null;
  return {
    fidelity: target === null ? null : fidelityToTarget(m, target),
    target: target === null ? null : typeof target === "string" ? target : `custom ${target.kind}`,
    concurrence: c,
    tangle: c === null ? null : c * c,
    purity,
    linearEntropy: (d / (d - 1)) * (1 - purity),
    vonNeumannEntropy: entropy + 0,
    negativity: twoQubit ? negativity(m) : null,
    chshMax: twoQubit ? chshMaximum(m) : null,
    eigenvalues,
    physical,
    phaseOptimised: twoQubit ? bestPhaseFamily(m, target) : null,
  };
}

function bestPhaseFamily(m: CMatrix, target: Target | null): PhaseOptimisedFidelity {
  if (target === "psi+" || target === "psi-") return phaseOptimisedFidelity(m, "HV/VH");
  if (target === "phi+" || target === "phi-") return phaseOptimisedFidelity(m, "HH/VV");
  const a = phaseOptimisedFidelity(m, "HV/VH");
  const b = phaseOptimisedFidelity(m, "HH/VV");
  return a.fidelity >= b.fidelity ? a : b;
}

/** S that ρ predicts at the given linear-polariser angles (default: the standard set for φ⁺). */
export function chshFromRho(rho: DensityMatrix | CMatrix, angles: BellAngles = STANDARD_BELL_ANGLES): number {
  return predictedChsh(rho, angles).s;
}
