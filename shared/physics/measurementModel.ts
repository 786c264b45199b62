/**
 * From rows (labels or waveplate angles) to the analysed product states |ψ_k⟩ = ⊗_i |a_k,i⟩,
 * so that each row measures the rank-one projector P_k = |ψ_k⟩⟨ψ_k| (physics contract §1–2).
 *
 * Label rows on an arm with calibrated plates use the angles of the setting sheet for that
 * calibration (what a student sets when following the sheet) and the projector computed
 * from them, not the ideal letter state.
 */
import type { ArmAngles, CountsRow, Handedness, Letter, SetupConventions } from "./types";
import { DEFAULT_HANDEDNESS, letterState, parseLabel } from "./states";
import { analyserState } from "./waveplates";
import { angleTable, MAX_PHOTONS, transmittedLetter } from "./settings";
import type { AnalyserAngles } from "./analyserAngles";
import type { CMatrix, CVector } from "./linalg/complexMatrix";

export interface MeasurementModel {
  photons: number;
  dimension: number;
  rows: number;
  /** Single-photon analysed states, index (k·photons + i)·2 + component. */
  singleRe: Float64Array;
  singleIm: Float64Array;
  /** Product states |ψ_k⟩, index k·dimension + basis index. */
  psiRe: Float64Array;
  psiIm: Float64Array;
}

/** Photon number of a row's setting. */
export function settingPhotons(setting: CountsRow["setting"]): number {
  return typeof setting === "string" ? setting.trim().length : setting.length;
}

export function buildModel(settings: readonly CountsRow["setting"][], conventions: SetupConventions = {}): MeasurementModel {
  if (settings.length === 0) throw new Error("no rows to reconstruct from");
  const photons = settingPhotons(settings[0]);
  if (photons < 1 || photons > MAX_PHOTONS) throw new Error(`row 1: a setting must name 1 … ${MAX_PHOTONS} photons, got ${photons}`);
  const handedness: Handedness = conventions.handedness ?? DEFAULT_HANDEDNESS;
  const d = 2 ** photons;
  const k = settings.length;
  const singleRe = new Float64Array(k * photons * 2);
  const singleIm = new Float64Array(k * photons * 2);
  const tables: (Map<Letter, AnalyserAngles> | null)[] = [];
  const tableFor = (arm: number) => {
    if (tables[arm] === undefined) {
      const cal = conventions.calibration?.[arm];
      tables[arm] = cal && isNonTrivial(cal) ? angleTable(handedness, cal) : null;
    }
    return tables[arm];
  };

  settings.forEach((setting, row) => {
    if (settingPhotons(setting) !== photons) {
      throw new Error(`row ${row + 1}: setting names ${settingPhotons(setting)} photon(s) but row 1 names ${photons}`);
    }
    const letters = typeof setting === "string" ? parseRowLabel(setting, row) : null;
    for (let arm = 0; arm < photons; arm++) {
      const state = letters
        ? labelArmState(letters[arm], arm, handedness, conventions, tableFor(arm))
        : angleArmState((setting as ArmAngles[])[arm], arm, row, conventions);
      const o = (row * photons + arm) * 2;
      singleRe[o] = state.re[0];
      singleRe[o + 1] = state.re[1];
      singleIm[o] = state.im[0];
      singleIm[o + 1] = state.im[1];
    }
  });
  const { psiRe, psiIm } = productStates(singleRe, singleIm, k, photons);
  return { photons, dimension: d, rows: k, singleRe, singleIm, psiRe, psiIm };
}

function parseRowLabel(label: string, row: number): Letter[] {
  try {
    return parseLabel(label);
  } catch (e) {
    throw new Error(`row ${row + 1}, field "setting": ${(e as Error).message}`);
  }
}

function labelArmState(
  letter: Letter,
  arm: number,
  handedness: Handedness,
  conventions: SetupConventions,
  table: Map<Letter, AnalyserAngles> | null,
): CVector {
  if (!table) return letterState(letter, handedness);
  const { letter: turned, reflected } = transmittedLetter(letter, conventions.bothPorts?.[arm] ?? false);
  const angles = table.get(turned)!;
  return analyserState({ ...angles, port: reflected ? "reflected" : "transmitted" }, conventions.calibration![arm]);
}

function angleArmState(angles: ArmAngles | undefined, arm: number, row: number, conventions: SetupConventions): CVector {
  if (!angles || !Number.isFinite(angles.qwpDeg) || !Number.isFinite(angles.hwpDeg)) {
    throw new Error(`row ${row + 1}: photon ${arm + 1} needs finite QWP and HWP angles`);
  }
  return analyserState(angles, conventions.calibration?.[arm] ?? {});
}

function isNonTrivial(cal: NonNullable<SetupConventions["calibration"]>[number]): boolean {
  return [cal.qwp?.fastAxisOffsetDeg, cal.qwp?.retardanceErrorDeg, cal.hwp?.fastAxisOffsetDeg, cal.hwp?.retardanceErrorDeg].some(
    (x) => x !== undefined && x !== 0,
  );
}

function productStates(sr: Float64Array, si: Float64Array, k: number, photons: number) {
  const d = 2 ** photons;
  const psiRe = new Float64Array(k * d);
  const psiIm = new Float64Array(k * d);
  for (let row = 0; row < k; row++) {
    for (let b = 0; b < d; b++) {
      let re = 1;
      let im = 0;
      for (let arm = 0; arm < photons; arm++) {
        const bit = (b >> (photons - 1 - arm)) & 1;
        const o = (row * photons + arm) * 2 + bit;
        const nr = re * sr[o] - im * si[o];
        im = re * si[o] + im * sr[o];
        re = nr;
      }
      psiRe[row * d + b] = re;
      psiIm[row * d + b] = im;
    }
  }
  return { psiRe, psiIm };
}

/**
 * The same rows written in another orthonormal basis: |ψ_k⟩ → U†|ψ_k⟩ with U's columns the new
 * basis vectors. Expectations are unchanged: ⟨ψ|U σ′ U†|ψ⟩ = ⟨U†ψ|σ′|U†ψ⟩. Only the product
 * vectors are rotated (the single-photon states keep the original basis).
 */
export function inBasis(model: MeasurementModel, u: CMatrix): MeasurementModel {
  const rotated = { ...model, psiRe: new Float64Array(model.rows * model.dimension), psiIm: new Float64Array(model.rows * model.dimension) };
  inBasisInto(model, u, rotated);
  return rotated;
}

/** inBasis into caller-owned arrays (out.psiRe, out.psiIm of length rows × dimension). */
export function inBasisInto(model: MeasurementModel, u: CMatrix, out: { psiRe: Float64Array; psiIm: Float64Array }): void {
  const d = model.dimension;
  const { psiRe, psiIm } = out;
  for (let k = 0; k < model.rows; k++) {
    const o = k * d;
    for (let j = 0; j < d; j++) {
      // (U†ψ)_j = Σ_i conj(U_ij) ψ_i
      let re = 0;
      let im = 0;
      for (let i = 0; i < d; i++) {
        const ur = u.re[i * d + j], ui = u.im[i * d + j];
        const pr = model.psiRe[o + i], pi = model.psiIm[o + i];
        re += ur * pr + ui * pi;
        im += ur * pi - ui * pr;
      }
      psiRe[o + j] = re;
      psiIm[o + j] = im;
    }
  }
}
