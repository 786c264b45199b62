/**
 * Adapters from the numeric core's figures of merit and Monte Carlo result to the JSON keys we
 * store (METRIC_KEYS in shared/schemas/reconstructions.ts).
 */
import { METRIC_KEYS, FIDELITY_KEY, type Metrics } from "@shared/schemas/reconstructions";
import type { BellTarget } from "@shared/schemas/sources";
import { fidelityToTarget, figuresOfMerit, type DensityMatrix, type MonteCarloResult } from "@shared/physics";
import { fromPlain, hermitianPart } from "@shared/physics/linalg/complexMatrix";

const DEG = 180 / Math.PI;

/** Every stored figure for one ρ; two-qubit figures are null for other photon numbers. */
export function figuresOf(rho: DensityMatrix): Metrics {
  const m = hermitianPart(fromPlain(rho));
  const f = figuresOfMerit(m, null);
  const twoQubit = m.n === 4;
  const psi = twoQubit ? figuresOfMerit(m, "psi-").phaseOptimised : null;
  const phi = twoQubit ? figuresOfMerit(m, "phi+").phaseOptimised : null;
  const bell = (name: BellTarget) => (twoQubit ? fidelityToTarget(m, name) : null);
  return {
    fidelityPhiPlus: bell("phi+"),
    fidelityPhiMinus: bell("phi-"),
    fidelityPsiPlus: bell("psi+"),
    fidelityPsiMinus: bell("psi-"),
    phaseFidelityPsi: psi?.fidelity ?? null,
    phasePsiDeg: psi ? psi.phase * DEG : null,
    phaseFidelityPhi: phi?.fidelity ?? null,
    phasePhiDeg: phi ? phi.phase * DEG : null,
    concurrence: f.concurrence,
    tangle: f.tangle,
    purity: f.purity,
    linearEntropy: f.linearEntropy,
    vonNeumannEntropy: f.vonNeumannEntropy,
    negativity: f.negativity,
    chshMax: f.chshMax,
  };
}

/**
 * The engine's Monte Carlo reports σ of the fidelity to one target (we ask for the source's
 * target) and of the phase-optimised fidelity of that target's family; the other Bell
 * fidelities and the optimal phases get no σ (null).
 */
export function uncertaintiesOf(mc: MonteCarloResult, target: BellTarget): { metrics: Metrics; rho: DensityMatrix } {
  const metrics = Object.fromEntries(METRIC_KEYS.map((k) => [k, null])) as Metrics;
  metrics[FIDELITY_KEY[target]] = mc.std.fidelity;
  metrics[target.startsWith("psi") ? "phaseFidelityPsi" : "phaseFidelityPhi"] = mc.std.phaseOptimisedFidelity;
  for (const k of ["concurrence", "tangle", "purity", "linearEntropy", "vonNeumannEntropy", "negativity", "chshMax"] as const) metrics[k] = mc.std[k];
  return { metrics, rho: mc.std.rho };
}
