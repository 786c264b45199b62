/**
 * Standard measurement sets and the printable setting sheet (physics contract §1–2).
 *
 * - tomo16: the 16 settings of James, Kwiat, Munro, White, Phys. Rev. A 64, 052312 (2001),
 *   in their order.
 * - tomo36: all 36 pairs of the six eigenstates (overcomplete), photon A's letter slowest.
 * - pairs9: the 9 basis pairs of the two-detector scheme; each setting gives 4 outcomes
 *   (transmitted/reflected port of each arm) — the same 36 projectors as tomo36.
 * - qubit4 / qubit6: one photon, {H, V, D, R} (James et al. 2001, §III) or all six.
 * - product4 / product6 / bases3: the same constructions for n = 1 … 4 photons (4ⁿ, 6ⁿ, 3ⁿ·2ⁿ).
 */
import type { ArmCalibration, Handedness, Letter, SetupConventions } from "./types";
import { DEFAULT_HANDEDNESS } from "./states";
import { anglesForLetter, type AnalyserAngles } from "./analyserAngles";

export type StandardSetId = "tomo16" | "tomo36" | "pairs9" | "qubit4" | "qubit6" | "product4" | "product6" | "bases3";

export const STANDARD_SET_IDS: readonly StandardSetId[] = ["tomo16", "tomo36", "pairs9", "qubit4", "qubit6", "product4", "product6", "bases3"];

export const MAX_PHOTONS = 4;

/** One waveplate setting of the sheet and the outcome labels counted at it. */
export interface SettingGroup {
  /** The setting's name: a label ("HV") or, for two-detector sets, the bases ("ZX"). */
  name: string;
  /** Labels counted at this setting, in the order of the counts-entry grid. */
  outcomes: string[];
}

export interface MeasurementSet {
  id: StandardSetId;
  photons: number;
  /** Every row label, in measurement order. */
  labels: string[];
  groups: SettingGroup[];
  /** True when both PBS ports of every arm are counted (two-detector scheme). */
  bothPorts: boolean;
}

const JAMES16 = ["HH", "HV", "VV", "VH", "RH", "RV", "DV", "DH", "DR", "DD", "RD", "HD", "VD", "VL", "HL", "RL"];
const SIX: Letter[] = ["H", "V", "D", "A", "R", "L"];
const FOUR: Letter[] = ["H", "V", "D", "R"];
/** Bases of the two-detector scheme: name, transmitted letter, reflected letter. */
const BASES: [string, Letter, Letter][] = [["Z", "H", "V"], ["X", "D", "A"], ["Y", "R", "L"]];

export function standardSet(id: StandardSetId, photons?: number): MeasurementSet {
  const fixed: Partial<Record<StandardSetId, number>> = { tomo16: 2, tomo36: 2, pairs9: 2, qubit4: 1, qubit6: 1 };
  const n = fixed[id] ?? photons ?? 2;
  if (fixed[id] !== undefined && photons !== undefined && photons !== fixed[id]) {
    throw new Error(`the set "${id}" is for ${fixed[id]} photon(s), not ${photons}`);
  }
  if (!Number.isInteger(n) || n < 1 || n > MAX_PHOTONS) throw new Error(`photons must be 1 … ${MAX_PHOTONS}, got ${n}`);
  switch (id) {
    case "tomo16":
      return singleDetector(id, n, JAMES16);
    case "tomo36":
    case "qubit6":
    case "product6":
      return singleDetector(id, n, cartesian(SIX, n));
    case "qubit4":
    case "product4":
      return singleDetector(id, n, cartesian(FOUR, n));
    case "pairs9":
    case "bases3":
      return twoDetector(id, n);
  }
}

function singleDetector(id: StandardSetId, photons: number, labels: string[]): MeasurementSet {
  return { id, photons, labels, groups: labels.map((l) => ({ name: l, outcomes: [l] })), bothPorts: false };
}

function twoDetector(id: StandardSetId, photons: number): MeasurementSet {
  const groups: SettingGroup[] = cartesianIndices(3, photons).map((bases) => ({
    name: bases.map((b) => BASES[b][0]).join(""),
    outcomes: cartesianIndices(2, photons).map((ports) => bases.map((b, i) => BASES[b][1 + ports[i]]).join("")),
  }));
  return { id, photons, labels: groups.flatMap((g) => g.outcomes), groups, bothPorts: true };
}

function cartesian(letters: Letter[], n: number): string[] {
  return cartesianIndices(letters.length, n).map((ix) => ix.map((i) => letters[i]).join(""));
}

function cartesianIndices(base: number, n: number): number[][] {
  const out: number[][] = [];
  for (let k = 0; k < base ** n; k++) {
    const digits: number[] = [];
    for (let i = n - 1, r = k; i >= 0; i--, r = Math.floor(r / base)) digits[i] = r % base;
    out.push(digits);
  }
  return out;
}

/** The letter whose setting is turned to measure `letter`: itself, or its basis partner at the transmitted port. */
export function transmittedLetter(letter: Letter, bothPorts: boolean): { letter: Letter; reflected: boolean } {
  if (!bothPorts) return { letter, reflected: false };
  const basis = BASES.find((b) => b[1] === letter || b[2] === letter)!;
  return { letter: basis[1], reflected: basis[2] === letter };
}

export interface SheetArm extends AnalyserAngles {
  /** What this arm's transmitted port analyses at this setting. */
  analyses: Letter;
}

export interface SheetSetting {
  index: number;
  name: string;
  outcomes: string[];
  arms: SheetArm[];
}

export interface SettingSheet {
  id: StandardSetId;
  photons: number;
  handedness: Handedness;
  bothPorts: boolean;
  settings: SheetSetting[];
}

/**
 * (QWP, HWP) angles to turn for every setting of a standard set, computed from the analyser
 * model with the given handedness and per-arm calibrations (see analyserAngles.ts).
 */
export function settingSheet(id: StandardSetId, photons?: number, conventions: SetupConventions = {}): SettingSheet {
  const set = standardSet(id, photons);
  const handedness = conventions.handedness ?? DEFAULT_HANDEDNESS;
  const perArm = Array.from({ length: set.photons }, (_, arm) => angleTable(handedness, conventions.calibration?.[arm]));
  const settings = set.groups.map((g, index) => {
    const letters = g.outcomes[0].split("") as Letter[];
    return {
      index,
      name: g.name,
      outcomes: g.outcomes,
      arms: letters.map((l, arm) => ({ analyses: l, ...perArm[arm].get(l)! })),
    };
  });
  return { id, photons: set.photons, handedness, bothPorts: set.bothPorts, settings };
}

/** Angles for each of the six letters in one arm. */
export function angleTable(handedness: Handedness, calibration: ArmCalibration = {}): Map<Letter, AnalyserAngles> {
  return new Map(SIX.map((l) => [l, anglesForLetter(l, handedness, calibration)]));
}
