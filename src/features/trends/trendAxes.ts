import type { TrendFigureKey, TrendXKey } from "@shared/schemas/trends";

/** Axis names shown to people; units in parentheses. */
export const X_LABEL: Record<TrendXKey, string> = {
  pumpPowerMw: "Pump power (mW)",
  crystalTemperatureC: "Crystal temperature (°C)",
  compensatorTiltDeg: "Compensator tilt (°)",
  exposureSeconds: "Exposure per setting (s)",
  recordedAt: "Time recorded",
  order: "Run number (sessions by date)",
};

export const FIGURE_LABEL: Record<TrendFigureKey, string> = {
  fidelityTarget: "Fidelity to the source's target",
  fidelityPhiPlus: "Fidelity to φ⁺",
  fidelityPhiMinus: "Fidelity to φ⁻",
  fidelityPsiPlus: "Fidelity to ψ⁺",
  fidelityPsiMinus: "Fidelity to ψ⁻",
  phaseFidelityPsi: "Phase-optimised fidelity (HV/VH)",
  phasePsiDeg: "Optimal phase φ, HV/VH (°)",
  phaseFidelityPhi: "Phase-optimised fidelity (HH/VV)",
  phasePhiDeg: "Optimal phase φ, HH/VV (°)",
  concurrence: "Concurrence",
  tangle: "Tangle",
  purity: "Purity",
  linearEntropy: "Linear entropy",
  vonNeumannEntropy: "Von Neumann entropy (bits)",
  negativity: "Negativity",
  chshMax: "CHSH maximum of ρ (Horodecki)",
  chshAbsS: "|S| measured (Bell runs)",
  visibilityHV: "Visibility, H/V basis (fringe runs)",
  visibilityDA: "Visibility, D/A basis (fringe runs)",
};

/** The order the figure picker offers them in. */
export const FIGURE_ORDER: TrendFigureKey[] = [
  "fidelityTarget", "concurrence", "purity", "chshMax", "chshAbsS", "visibilityHV", "visibilityDA", "tangle", "negativity",
  "linearEntropy", "vonNeumannEntropy", "phaseFidelityPsi", "phasePsiDeg", "phaseFidelityPhi", "phasePhiDeg",
  "fidelityPhiPlus", "fidelityPhiMinus", "fidelityPsiPlus", "fidelityPsiMinus",
];

export const X_ORDER: TrendXKey[] = ["pumpPowerMw", "crystalTemperatureC", "compensatorTiltDeg", "exposureSeconds", "recordedAt", "order"];

export function timeTick(ms: number): string {
  return new Date(ms).toLocaleString("en-GB", { day: "2-digit", month: "short", hour: "2-digit", minute: "2-digit" });
}
