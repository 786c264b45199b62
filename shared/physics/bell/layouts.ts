/**
 * The settings a Bell test or a fringe scan measures, as waveplate angles per arm (QWP θ,
 * HWP θ/2 make a linear analyser at θ), and the Bell-diagonal states used to invent data for
 * them. Used by the demo data, the tests and the entry templates.
 */
import { fromPauliCoefficients } from "../pauliBasis";
import { toPlain } from "../linalg/complexMatrix";
import type { ArmAngles, DensityMatrix } from "../types";
import { type BellAngles, settingPairs } from "./angles";
import { armAnglesForPolariser } from "./settingAngles";

/** The sixteen settings of a CHSH test: per analyser pair (α,β), (α⊥,β⊥), (α,β⊥), (α⊥,β). */
export function bellTestSettings(angles: BellAngles): ArmAngles[][] {
  return settingPairs(angles).flatMap(({ alphaDeg: a, betaDeg: b }) =>
    [[a, b], [a + 90, b + 90], [a, b + 90], [a + 90, b]].map(([x, y]) => [armAnglesForPolariser(x), armAnglesForPolariser(y)]),
  );
}

/** Arm A fixed at `fixedDeg`, arm B at each of `scanDeg`. */
export function fringeScanSettings(fixedDeg: number, scanDeg: readonly number[]): ArmAngles[][] {
  return scanDeg.map((theta) => [armAnglesForPolariser(fixedDeg), armAnglesForPolariser(theta)]);
}

/**
 * ρ = ¼(I⊗I + t_x σ_x⊗σ_x + t_y σ_y⊗σ_y + t_z σ_z⊗σ_z), the Bell-diagonal states (Horodecki &
 * Horodecki, Phys. Rev. A 54, 1838 (1996)); ψ⁻ is t = (−1, −1, −1). Its eigenvalues are
 * ¼(1 − t_x − t_y − t_z), ¼(1 − t_x + t_y + t_z), ¼(1 + t_x − t_y + t_z), ¼(1 + t_x + t_y − t_z)
 * (same paper); a negative one is refused.
 */
export function bellDiagonalState(tx: number, ty: number, tz: number): DensityMatrix {
  const eigenvalues = [1 - tx - ty - tz, 1 - tx + ty + tz, 1 + tx - ty + tz, 1 + tx + ty - tz].map((x) => x / 4);
  if (eigenvalues.some((l) => l < -1e-12)) throw new Error(`t = (${tx}, ${ty}, ${tz}) is not a physical Bell-diagonal state`);
  const x = new Float64Array(16);
  x[0] = 1;
  x[1 * 4 + 1] = tx;
  x[2 * 4 + 2] = ty;
  x[3 * 4 + 3] = tz;
  return toPlain(fromPauliCoefficients(x, 2));
}
