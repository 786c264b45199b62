/**
 * Rates for trend plots, from the raw rows of any run.
 *
 * Pair rate (our definition): the coincidence rate summed over the four outcomes of one
 * complete product basis {u, u⊥} ⊗ {v, v⊥} (e.g. HH + HV + VH + VV), which counts every
 * detected pair once whatever the state; averaged over all complete bases among the rows,
 * with σ from Poisson counts, Var r = n/t² (common practice, no source). Null when the rows
 * contain no complete basis (e.g. a fringe scan).
 *
 * Accidental rate: Σ_k A_k / Σ_k t_k with A_k = s_a,k · s_b,k · τ / t_k (physics contract §3,
 * computed by the engine's prepareCounts).
 */
import { prepareCounts } from "../corrections";
import { letterState, parseLabel } from "../states";
import type { CountsRow } from "../types";
import { analyserState } from "../waveplates";
import type { CVector } from "../linalg/complexMatrix";

export interface RateWithSigma {
  value: number;
  sigma: number;
}

export function pairRate(rows: readonly CountsRow[]): RateWithSigma | null {
  const keyed = new Map<string, number>();
  const blochs = rows.map((r) => armBlochs(r.setting));
  blochs.forEach((b, i) => {
    if (b) keyed.set(key(b[0]) + "|" + key(b[1]), i);
  });
  let sum = 0;
  let variance = 0;
  let bases = 0;
  blochs.forEach((b) => {
    if (!b || !isCanonical(b[0]) || !isCanonical(b[1])) return;
    const [u, v] = b;
    const members = [[u, v], [neg(u), v], [u, neg(v)], [neg(u), neg(v)]].map(([x, y]) => keyed.get(key(x) + "|" + key(y)));
    if (members.some((m) => m === undefined)) return;
    bases++;
    for (const m of members as number[]) {
      const t = rows[m].seconds ?? 1;
      sum += rows[m].counts / t;
      variance += rows[m].counts / t ** 2;
    }
  });
  if (bases === 0) return null;
  return { value: sum / bases, sigma: Math.sqrt(variance) / bases };
}

/** Null when a row lacks singles or no window is known. */
export function accidentalRate(rows: readonly CountsRow[], windowNs: number | null): number | null {
  if (!windowNs || rows.some((r) => r.singlesA === undefined || r.singlesB === undefined)) return null;
  const { accidentals } = prepareCounts(rows, { windowNs });
  const totalT = rows.reduce((s, r) => s + (r.seconds ?? 1), 0);
  return accidentals!.reduce((s, a) => s + a, 0) / totalT;
}

type Bloch = [number, number, number];

function armBlochs(setting: CountsRow["setting"]): [Bloch, Bloch] | null {
  let states: CVector[];
  if (typeof setting === "string") {
    const letters = parseLabel(setting);
    if (letters.length !== 2) return null;
    states = letters.map((l) => letterState(l));
  } else {
    if (setting.length !== 2) return null;
    states = setting.map((arm) => analyserState(arm));
  }
  return [bloch(states[0]), bloch(states[1])];
}

/** Stokes vector of a single-photon state (X, Y, Z) = (2 Re h̄v, 2 Im h̄v, |h|² − |v|²). */
function bloch(s: CVector): Bloch {
  return [2 * (s.re[0] * s.re[1] + s.im[0] * s.im[1]), 2 * (s.re[0] * s.im[1] - s.im[0] * s.re[1]), s.re[0] ** 2 + s.im[0] ** 2 - s.re[1] ** 2 - s.im[1] ** 2];
}

const neg = (b: Bloch): Bloch => [-b[0], -b[1], -b[2]];

/** One of each antipodal pair: the first component that is not ~0 is positive. */
function isCanonical(b: Bloch): boolean {
  for (const x of b) if (Math.abs(x) > 1e-6) return x > 0;
  return false;
}

function key(b: Bloch): string {
  return b.map((x) => (Math.abs(x) < 5e-7 ? 0 : Math.round(x * 1e6))).join(",");
}
