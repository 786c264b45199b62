/**
 * Which figures of merit the scorecard lists, in which order and under which words, for a
 * reconstruction whose source aims at `target`.
 */
import { FIDELITY_KEY, type MetricKey, type Metrics, type ReconstructionMethod } from "@shared/schemas/reconstructions";
import type { BellTarget } from "@shared/schemas/sources";

export const BELL_SYMBOL: Record<BellTarget, string> = { "phi+": "Φ⁺", "phi-": "Φ⁻", "psi+": "Ψ⁺", "psi-": "Ψ⁻" };

export const METHOD_NAME: Record<ReconstructionMethod, string> = {
  linear: "Linear inversion",
  mle: "Maximum likelihood",
  projected: "Projected least squares",
};

export interface MeritRow {
  key: MetricKey;
  label: string;
  /** Shown after the label in a quieter voice, e.g. the definition or the unit. */
  hint?: string;
  value: number | null;
  uncertainty: number | null;
  unit?: string;
  /** A companion figure shown beside the value, e.g. the optimal phase; `suffix` follows the number without a space (°). */
  companion?: { label: string; value: number | null; uncertainty: number | null; suffix: string };
}

const pick = (m: Metrics, s: Metrics | null | undefined, key: MetricKey) => ({ value: m[key], uncertainty: s?.[key] ?? null });

/** The scorecard rows: fidelity to the target first, then entanglement, then mixedness, then CHSH. */
export function meritRows(metrics: Metrics, sigma: Metrics | null | undefined, target: BellTarget): MeritRow[] {
  const family = target.startsWith("psi") ? "Psi" : "Phi";
  const phaseKey = `phase${family}Deg` as MetricKey;
  const familyWords = family === "Psi" ? "HV + e^iφ VH" : "HH + e^iφ VV";
  const rows: MeritRow[] = [
    { key: FIDELITY_KEY[target], label: `Fidelity to ${BELL_SYMBOL[target]}`, hint: "the source's target", ...pick(metrics, sigma, FIDELITY_KEY[target]) },
    {
      key: `phaseFidelity${family}` as MetricKey,
      label: "Fidelity, best phase",
      hint: `to ${familyWords}`,
      ...pick(metrics, sigma, `phaseFidelity${family}` as MetricKey),
      companion: { label: "φ", suffix: "°", ...pick(metrics, sigma, phaseKey) },
    },
    { key: "concurrence", label: "Concurrence", hint: "Wootters", ...pick(metrics, sigma, "concurrence") },
    { key: "tangle", label: "Tangle", hint: "C²", ...pick(metrics, sigma, "tangle") },
    { key: "negativity", label: "Negativity", hint: "partial transpose", ...pick(metrics, sigma, "negativity") },
    { key: "purity", label: "Purity", hint: "Tr ρ²", ...pick(metrics, sigma, "purity") },
    { key: "linearEntropy", label: "Linear entropy", hint: "4/3 (1 − Tr ρ²)", ...pick(metrics, sigma, "linearEntropy") },
    { key: "vonNeumannEntropy", label: "Von Neumann entropy", hint: "bits", ...pick(metrics, sigma, "vonNeumannEntropy") },
    { key: "chshMax", label: "Largest CHSH value", hint: "Horodecki; local bound 2", ...pick(metrics, sigma, "chshMax") },
  ];
  return rows;
}

/** The fidelities to the three Bell states that are not the target, for the secondary list. */
export function otherBellFidelities(metrics: Metrics, sigma: Metrics | null | undefined, target: BellTarget): MeritRow[] {
  return (Object.keys(FIDELITY_KEY) as BellTarget[])
    .filter((b) => b !== target)
    .map((b) => ({ key: FIDELITY_KEY[b], label: `Fidelity to ${BELL_SYMBOL[b]}`, ...pick(metrics, sigma, FIDELITY_KEY[b]) }));
}
