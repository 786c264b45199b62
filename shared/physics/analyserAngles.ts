/**
 * The inverse of the analyser model: which (QWP, HWP) angles make an arm analyse a given
 * state, honouring the plates' calibrations. Feeds the printable setting sheet.
 *
 * Method (our choice; the contract only fixes the forward model): scan q, h ∈ [0°, 180°)
 * on a 7.5° grid (which contains the ideal solutions 0°, ±22.5°, ±45°), refine every grid
 * local minimum of the infidelity 1 − |⟨target|a(q, h)⟩|² by damped Newton steps, and keep
 * the best. Among equally good solutions (infidelity within 1e-10) we prefer the smallest
 * |q| + |h| with angles written in (−90°, 90°], then non-negative q, then non-negative h, so
 * ideal plates give the familiar values (H: 0°, 0°; V: 0°, 45°; D: 45°, 22.5°; …).
 * With retardance errors some states cannot be reached exactly; `fidelity` says how close
 * the returned angles come.
 */
import type { ArmCalibration, Letter, Handedness } from "./types";
import type { CVector } from "./linalg/complexMatrix";
import { analyserState, overlap2 } from "./waveplates";
import { letterState } from "./states";

export interface AnalyserAngles {
  qwpDeg: number;
  hwpDeg: number;
  /** |⟨target|analysed⟩|² reached with these angles (1 for an exact solution). */
  fidelity: number;
}

const GRID_STEP = 7.5;
const GRID = 180 / GRID_STEP;
const TIE = 1e-10;

export function anglesForState(target: CVector, calibration: ArmCalibration = {}): AnalyserAngles {
  const infidelity = (q: number, h: number) =>
    1 - overlap2(target, analyserState({ qwpDeg: q, hwpDeg: h }, calibration));
  const grid = new Float64Array(GRID * GRID);
  for (let i = 0; i < GRID; i++) for (let j = 0; j < GRID; j++) grid[i * GRID + j] = infidelity(i * GRID_STEP, j * GRID_STEP);

  const candidates: AnalyserAngles[] = [];
  for (let i = 0; i < GRID; i++) {
    for (let j = 0; j < GRID; j++) {
      if (!isLocalMinimum(grid, i, j)) continue;
      const [q, h] = refine(infidelity, i * GRID_STEP, j * GRID_STEP);
      candidates.push({ qwpDeg: wrapAngle(q), hwpDeg: wrapAngle(h), fidelity: 1 - infidelity(q, h) });
    }
  }
  const best = Math.max(...candidates.map((c) => c.fidelity));
  const good = candidates.filter((c) => c.fidelity >= best - TIE);
  good.sort(preferNiceAngles);
  const chosen = good[0];
  return { qwpDeg: tidy(chosen.qwpDeg), hwpDeg: tidy(chosen.hwpDeg), fidelity: Math.min(1, chosen.fidelity) };
}

export function anglesForLetter(letter: Letter, handedness: Handedness, calibration: ArmCalibration = {}): AnalyserAngles {
  return anglesForState(letterState(letter, handedness), calibration);
}

function isLocalMinimum(grid: Float64Array, i: number, j: number): boolean {
  const v = grid[i * GRID + j];
  for (let di = -1; di <= 1; di++) {
    for (let dj = -1; dj <= 1; dj++) {
      if (di === 0 && dj === 0) continue;
      const ni = (i + di + GRID) % GRID;
      const nj = (j + dj + GRID) % GRID;
      if (grid[ni * GRID + nj] < v) return false;
    }
  }
  return true;
}

/** Damped Newton on f(q, h) with central-difference derivatives (angles in degrees). */
function refine(f: (q: number, h: number) => number, q0: number, h0: number): [number, number] {
  let q = q0;
  let h = h0;
  let fq = f(q, h);
  let damping = 1e-3;
  const e = 1e-3;
  for (let iter = 0; iter < 60 && fq > 0; iter++) {
    const gq = (f(q + e, h) - f(q - e, h)) / (2 * e);
    const gh = (f(q, h + e) - f(q, h - e)) / (2 * e);
    const hqq = (f(q + e, h) - 2 * fq + f(q - e, h)) / (e * e);
    const hhh = (f(q, h + e) - 2 * fq + f(q, h - e)) / (e * e);
    const hqh = (f(q + e, h + e) - f(q + e, h - e) - f(q - e, h + e) + f(q - e, h - e)) / (4 * e * e);
    let improved = false;
    for (let attempt = 0; attempt < 20 && !improved; attempt++) {
      const a = hqq + damping;
      const d = hhh + damping;
      const det = a * d - hqh * hqh;
      if (det > 0) {
        const sq = -(d * gq - hqh * gh) / det;
        const sh = -(a * gh - hqh * gq) / det;
        const fn = f(q + sq, h + sh);
        if (fn < fq) {
          q += sq;
          h += sh;
          fq = fn;
          damping = Math.max(damping / 10, 1e-12);
          improved = true;
          continue;
        }
      }
      damping *= 10;
    }
    if (!improved) break;
  }
  return [q, h];
}

/** Writes an angle (period 180°) into (−90°, 90°]. */
export function wrapAngle(deg: number): number {
  let a = ((deg % 180) + 180) % 180;
  if (a > 90) a -= 180;
  return a;
}

/** Removes rounding noise such as 22.499999999999996 → 22.5 (keeps 1e-9° resolution). */
function tidy(deg: number): number {
  const r = Math.round(deg * 1e9) / 1e9;
  return r === 0 ? 0 : r;
}

function preferNiceAngles(a: AnalyserAngles, b: AnalyserAngles): number {
  const cost = (x: AnalyserAngles) => Math.abs(x.qwpDeg) + Math.abs(x.hwpDeg);
  const dc = cost(a) - cost(b);
  if (Math.abs(dc) > 1e-6) return dc;
  if ((a.qwpDeg >= 0) !== (b.qwpDeg >= 0)) return a.qwpDeg >= 0 ? -1 : 1;
  if ((a.hwpDeg >= 0) !== (b.hwpDeg >= 0)) return a.hwpDeg >= 0 ? -1 : 1;
  return 0;
}
