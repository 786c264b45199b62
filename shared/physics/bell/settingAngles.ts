/**
 * Which linear-polariser angle a stored setting stands for, per arm. Bell tests and fringe
 * scans are taken with linear analysers; rows store either labels (H, V, D, A) or the
 * waveplate angles turned (QWP → HWP → PBS, physics contract §2).
 *
 * For waveplate angles we compute the analysed state of ideal plates and read its direction
 * on the Poincaré sphere: Stokes X = 2 Re(h̄ v), Y = 2 Im(h̄ v), Z = |h|² − |v|², polariser angle
 * θ = ½ atan2(X, Z) (Born & Wolf, "Principles of Optics", §1.4.2). Ideal plates on purpose:
 * the angle names the intended setting, so rows group the same way whatever the calibration.
 * A state with |Y| > sin(2 · 0.5°) is elliptical and cannot be one of these settings.
 */
import { EngineInputError } from "../errors";
import { parseLabel } from "../states";
import type { ArmAngles, CountsRow, Letter } from "../types";
import { analyserState } from "../waveplates";

const LINEAR_LETTER_DEG: Partial<Record<Letter, number>> = { H: 0, V: 90, D: 45, A: 135 };
export const MAX_ELLIPTICITY = Math.sin((2 * 0.5 * Math.PI) / 180);

/** Polariser angle in [0°, 180°) an arm's waveplates analyse; throws if it is not linear. */
export function polariserAngleOfArm(arm: ArmAngles): number {
  const s = analyserState(arm);
  const hv = { re: s.re[0] * s.re[1] + s.im[0] * s.im[1], im: s.re[0] * s.im[1] - s.im[0] * s.re[1] };
  const z = s.re[0] ** 2 + s.im[0] ** 2 - s.re[1] ** 2 - s.im[1] ** 2;
  if (Math.abs(2 * hv.im) > MAX_ELLIPTICITY) {
    throw new Error(
      `QWP ${arm.qwpDeg}°, HWP ${arm.hwpDeg}° analyse an elliptical polarisation; a linear analyser at θ needs the QWP at θ and the HWP at θ/2`,
    );
  }
  const theta = (Math.atan2(2 * hv.re, z) * 90) / Math.PI;
  const wrapped = ((theta % 180) + 180) % 180;
  return Math.round(wrapped * 1e9) / 1e9 % 180;
}

/** Polariser angles of photon A and photon B for one row; the error names the row and arm. */
export function rowPolariserAngles(setting: CountsRow["setting"], rowIndex: number): [number, number] {
  const where = `row ${rowIndex + 1}`;
  if (typeof setting === "string") {
    let letters: Letter[];
    try {
      letters = parseLabel(setting);
    } catch (e) {
      throw new EngineInputError("invalid_input", `${where}: ${(e as Error).message}`);
    }
    if (letters.length !== 2) throw new EngineInputError("invalid_input", `${where}: "${setting}" is not a two-photon setting`);
    return letters.map((l, arm) => {
      const deg = LINEAR_LETTER_DEG[l];
      if (deg === undefined) throw new EngineInputError("invalid_input", `${where}, arm ${arm === 0 ? "A" : "B"}: ${l} is circular; these analyses need linear polarisers`);
      return deg;
    }) as [number, number];
  }
  if (setting.length !== 2) throw new EngineInputError("invalid_input", `${where}: give the waveplate angles of both arms (A, then B)`);
  return setting.map((arm, i) => {
    try {
      return polariserAngleOfArm(arm);
    } catch (e) {
      throw new EngineInputError("invalid_input", `${where}, arm ${i === 0 ? "A" : "B"}: ${(e as Error).message}`);
    }
  }) as [number, number];
}

/** Waveplate angles that set a linear analyser at θ with ideal plates: QWP θ, HWP θ/2. */
export function armAnglesForPolariser(thetaDeg: number): ArmAngles {
  return { qwpDeg: thetaDeg, hwpDeg: thetaDeg / 2 };
}
