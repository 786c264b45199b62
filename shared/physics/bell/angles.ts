/**
 * Analyser angles of a CHSH test (physics contract §7). Angles are those of a linear
 * polariser (the transmitted state is cos θ |H⟩ + sin θ |V⟩); a half-wave plate in front of a
 * fixed polariser turns by half of them. The orthogonal outcome of θ is θ + 90°.
 */
import type { CVector } from "../linalg/complexMatrix";

export interface BellAngles {
  aDeg: number;
  aPrimeDeg: number;
  bDeg: number;
  bPrimeDeg: number;
}

/**
 * The settings that give the maximal violation for |φ⁺⟩: a = 0°, a′ = 45°, b = 22.5°,
 * b′ = 67.5° (Clauser, Horne, Shimony, Holt, PRL 23, 880 (1969); physics contract §7).
 */
export const STANDARD_BELL_ANGLES: Readonly<BellAngles> = { aDeg: 0, aPrimeDeg: 45, bDeg: 22.5, bPrimeDeg: 67.5 };

export type SettingPairName = "a,b" | "a,b'" | "a',b" | "a',b'";

export interface SettingPair {
  name: SettingPairName;
  alphaDeg: number;
  betaDeg: number;
  /** Sign of E(α, β) in S = E(a,b) − E(a,b′) + E(a′,b) + E(a′,b′). */
  sign: 1 | -1;
}

/** The four analyser pairs of S, in the order of the CHSH sum. */
export function settingPairs(angles: BellAngles): SettingPair[] {
  return [
    { name: "a,b", alphaDeg: angles.aDeg, betaDeg: angles.bDeg, sign: 1 },
    { name: "a,b'", alphaDeg: angles.aDeg, betaDeg: angles.bPrimeDeg, sign: -1 },
    { name: "a',b", alphaDeg: angles.aPrimeDeg, betaDeg: angles.bDeg, sign: 1 },
    { name: "a',b'", alphaDeg: angles.aPrimeDeg, betaDeg: angles.bPrimeDeg, sign: 1 },
  ];
}

/** Angles closer than this (degrees, modulo 180°) are the same analyser setting. */
export const ANGLE_TOLERANCE_DEG = 1e-6;

/** A polariser at θ and at θ + 180° transmits the same state. */
export function sameAnalyser(xDeg: number, yDeg: number): boolean {
  const d = (((xDeg - yDeg) % 180) + 180) % 180;
  return d < ANGLE_TOLERANCE_DEG || 180 - d < ANGLE_TOLERANCE_DEG;
}

/** The state a linear polariser at θ transmits: cos θ |H⟩ + sin θ |V⟩. */
export function linearPolarisation(thetaDeg: number): CVector {
  const t = (thetaDeg * Math.PI) / 180;
  return { re: Float64Array.of(Math.cos(t), Math.sin(t)), im: new Float64Array(2) };
}
