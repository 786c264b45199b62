/**
 * Feedback while counts are typed (before anything is saved): which rows are still empty or
 * unreadable, zeros, counts far from what the other rows imply, low statistics, and the live
 * linear estimate with its eigenvalues.
 *
 * "Far from what the rest imply" (our rule; common practice has no single one): fit the
 * physical least-squares estimate of Smolin, Gambetta, Smith (PRL 108, 070502, 2012) to all
 * rows and predict every row's counts μ̂ from it. The row that misses μ̂ by the most Poisson
 * standard deviations — if by more than OUTLIER_SIGMA of them and by more than OUTLIER_SHARE
 * of the largest count — is flagged, its count is set aside (replaced by μ̂) and the fit is
 * repeated, up to MAX_OUTLIERS times. One gross typo drags the fit for every row, so flagging
 * all rows that miss the first fit would blame the innocent; taking the worst one at a time
 * does not. A linear estimate alone cannot do this for the 16-setting set: it fits 16 rows
 * with 16 parameters exactly.
 */
import { figuresOfMerit, reconstruct, type CountsRow, type FiguresOfMerit, type Reconstruction, type SetupConventions, type Target } from "@shared/physics";

export const OUTLIER_SIGMA = 6;
export const OUTLIER_SHARE = 0.05;
export const MAX_OUTLIERS = 3;
const IMPUTE_STEPS = 30;
/** Below this mean count per row, Poisson noise alone is over 30 % (1/√10). */
export const LOW_MEAN_COUNT = 10;

export interface EntryRow {
  label: string;
  counts: unknown;
  seconds?: unknown;
  singlesA?: unknown;
  singlesB?: unknown;
}

export interface Outlier {
  row: number;
  counts: number;
  expected: number;
}

export interface EntryChecks {
  total: number;
  filled: number;
  /** Rows whose counts are not a whole number ≥ 0 (0-based). */
  unreadable: number[];
  zeros: number[];
  outliers: Outlier[];
  lowCounts: boolean;
  /** The linear estimate once every row has a readable count, and its figures of merit. */
  linear: Reconstruction | null;
  figures: FiguresOfMerit | null;
  /** Why there is no estimate yet, or why the engine refused one. */
  estimateNote: string | null;
}

const isCount = (x: unknown): x is number => typeof x === "number" && Number.isInteger(x) && x >= 0;
const positiveOr1 = (x: unknown) => (typeof x === "number" && x > 0 ? x : 1);

export function checkEntry(rows: EntryRow[], conventions: SetupConventions, target: Target = "psi-"): EntryChecks {
  const unreadable: number[] = [];
  const zeros: number[] = [];
  let filled = 0;
  rows.forEach((r, i) => {
    if (r.counts === undefined || r.counts === "") return;
    filled++;
    if (!isCount(r.counts)) unreadable.push(i);
    else if (r.counts === 0) zeros.push(i);
  });
  const base = { total: rows.length, filled, unreadable, zeros, outliers: [] as Outlier[], lowCounts: false, linear: null, figures: null, estimateNote: null };
  if (filled < rows.length || unreadable.length) {
    const missing = rows.length - filled;
    const note = unreadable.length
      ? `Row${unreadable.length > 1 ? "s" : ""} ${unreadable.map((i) => i + 1).join(", ")} ${unreadable.length > 1 ? "are" : "is"} not a whole number of counts.`
      : `${missing} of ${rows.length} rows still need counts; the estimate appears when all are in.`;
    return { ...base, estimateNote: note };
  }
  const engineRows: CountsRow[] = rows.map((r) => ({ setting: r.label, counts: r.counts as number, seconds: positiveOr1(r.seconds) }));
  const sum = engineRows.reduce((a, r) => a + r.counts, 0);
  const lowCounts = sum / rows.length < LOW_MEAN_COUNT;
  try {
    const linear = reconstruct({ rows: engineRows, conventions }, { method: "linear" });
    return { ...base, lowCounts, linear, figures: figuresOfMerit(linear.rho, target), outliers: findOutliers(engineRows, conventions) };
  } catch (e) {
    return { ...base, lowCounts, estimateNote: (e as Error).message };
  }
}

function findOutliers(rows: CountsRow[], conventions: SetupConventions): Outlier[] {
  const largest = Math.max(...rows.map((r) => r.counts));
  const working = rows.map((r) => ({ ...r }));
  const flagged: number[] = [];
  const fit = () => reconstruct({ rows: working, conventions }, { method: "projected" }).expectedCounts;
  let expected = fit();
  for (let round = 0; round < MAX_OUTLIERS; round++) {
    let worst = -1;
    let worstZ = OUTLIER_SIGMA;
    working.forEach((r, i) => {
      const miss = Math.abs(r.counts - expected[i]);
      const z = miss / Math.sqrt(Math.max(expected[i], 1));
      if (!flagged.includes(i) && z > worstZ && miss > OUTLIER_SHARE * largest) {
        worst = i;
        worstZ = z;
      }
    });
    if (worst < 0) break;
    flagged.push(worst);
    expected = imputeFlagged(working, flagged, fit);
  }
  return flagged.map((row) => ({ row, counts: rows[row].counts, expected: expected[row] }));
}

/**
 * Sets the flagged rows aside: their counts are replaced by what the fit to the others predicts,
 * refitting until those predictions settle (a fixed-point iteration; each step can only move the
 * set-aside rows toward agreement with the rest).
 */
function imputeFlagged(working: CountsRow[], flagged: number[], fit: () => number[]): number[] {
  let expected = fit();
  for (let step = 0; step < IMPUTE_STEPS; step++) {
    let change = 0;
    for (const i of flagged) {
      change = Math.max(change, Math.abs(working[i].counts - expected[i]) / Math.max(expected[i], 1));
      working[i].counts = expected[i];
    }
    expected = fit();
    if (change < 0.01) break;
  }
  return expected;
}
