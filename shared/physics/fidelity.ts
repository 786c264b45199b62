/**
 * Fidelities (physics contract §6).
 * - Pure target: F = ⟨ψ|ρ|ψ⟩ (Jozsa, J. Mod. Opt. 41, 2315 (1994)).
 * - Mixed target: F = (Tr √(√σ ρ √σ))² (Uhlmann, Rep. Math. Phys. 9, 273 (1976); Jozsa 1994).
 *   We put the target's square root outside, so the formula stays defined when ρ is a
 *   non-physical estimate; negative eigenvalues of √σ ρ √σ are then skipped (flagged upstream).
 *   Accuracy: ~1e-12 for full-rank states; for rank-deficient ones, eigenvalues at rounding
 *   level are dropped (see below).
 * - Phase-optimised fidelity to (|a⟩ + e^{iφ}|b⟩)/√2: (ρ_aa + ρ_bb)/2 + |ρ_ab| at
 *   φ = −arg ρ_ab (follows from F = (ρ_aa + ρ_bb)/2 + Re(e^{iφ} ρ_ab)).
 */
import type { Target } from "./types";
import { type CMatrix, type CVector, expectation, fromPlain, hermitianPart, multiply, traceRe } from "./linalg/complexMatrix";
import { hermitianEigenvalues, hermitianFunction } from "./linalg/hermitianEigen";
import { BELL_STATES, normalised, toCVector } from "./states";

export function pureStateFidelity(rho: CMatrix, psi: CVector): number {
  return expectation(rho, normalised(psi));
}

/**
 * Mixed-state fidelity (Tr √(√σ ρ √σ))² (Uhlmann, Rep. Math. Phys. 9, 273 (1976); Jozsa,
 * J. Mod. Opt. 41, 2315 (1994)). Symmetric in ρ and σ for physical states, so this equals the
 * contract's (Tr √(√ρ σ √ρ))²; we take the root of the target σ, which is always positive,
 * so the value stays defined when ρ is a non-physical linear estimate.
 *
 * Eigenvalues of √σ ρ √σ below 4·d·ε·λ_max are rounding noise of zero (a rank-deficient
 * state); left in, their square roots (~1e-8 each) would spoil the sum.
 */
export function uhlmannFidelity(rho: CMatrix, sigma: CMatrix): number {
  const root = hermitianFunction(hermitianPart(sigma), (l) => Math.sqrt(Math.max(0, l)));
  const inner = hermitianPart(multiply(multiply(root, rho), root));
  const values = hermitianEigenvalues(inner);
  const noise = 4 * rho.n * Number.EPSILON * Math.max(0, values[0]);
  let s = 0;
  for (const l of values) if (l > noise) s += Math.sqrt(l);
  return s * s;
}

/** Resolves a target to a pure state vector or a unit-trace density matrix. */
export function resolveTarget(target: Target, dimension: number): { vector: CVector } | { matrix: CMatrix } {
  if (typeof target === "string") {
    const v = BELL_STATES[target];
    if (!v) throw new Error(`unknown target "${target}" (expected phi+, phi-, psi+ or psi-)`);
    if (dimension !== 4) throw new Error(`the Bell target "${target}" needs two photons`);
    return { vector: toCVector(v) };
  }
  if (target.kind === "vector") {
    if (target.vector.re.length !== dimension || target.vector.im.length !== dimension) {
      throw new Error(`the target vector needs ${dimension} complex entries`);
    }
    return { vector: normalised(toCVector(target.vector)) };
  }
  const m = fromPlain(target.rho);
  if (m.n !== dimension) throw new Error(`the target density matrix must be ${dimension}×${dimension}`);
  const t = traceRe(m);
  if (!(t > 0)) throw new Error("the target density matrix has trace ≤ 0");
  const unit = hermitianPart({ n: m.n, re: m.re.map((x) => x / t), im: m.im.map((x) => x / t) });
  if (hermitianEigenvalues(unit)[m.n - 1] < -1e-9) throw new Error("the target density matrix has a negative eigenvalue");
  return { matrix: unit };
}

export function fidelityToTarget(rho: CMatrix, target: Target): number {
  const t = resolveTarget(target, rho.n);
  return "vector" in t ? expectation(rho, t.vector) : uhlmannFidelity(rho, t.matrix);
}

export interface PhaseOptimisedFidelity {
  fidelity: number;
  /** φ in radians, (−π, π], of the best (|a⟩ + e^{iφ}|b⟩)/√2. */
  phase: number;
  /** "HV/VH" for (|HV⟩ + e^{iφ}|VH⟩)/√2, "HH/VV" for (|HH⟩ + e^{iφ}|VV⟩)/√2. */
  family: "HV/VH" | "HH/VV";
}

export function phaseOptimisedFidelity(rho: CMatrix, family: PhaseOptimisedFidelity["family"]): PhaseOptimisedFidelity {
  const [a, b] = family === "HV/VH" ? [1, 2] : [0, 3];
  const n = rho.n;
  const re = rho.re[a * n + b];
  const im = rho.im[a * n + b];
  const fidelity = 0.5 * (rho.re[a * n + a] + rho.re[b * n + b]) + Math.sqrt(re * re + im * im);
  const phase = re === 0 && im === 0 ? 0 : -Math.atan2(im, re);
  return { fidelity, phase: phase === -Math.PI ? Math.PI : phase + 0, family };
}
