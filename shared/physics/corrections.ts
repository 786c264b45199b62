/**
 * Counts, exposures and corrections → the numbers the estimators use (physics contract §3).
 * The raw rows are only read; every correction is a parameter and is reported back.
 *
 * - Expected counts μ_k = w_k · Tr(σ P_k) with weight w_k = t_k · η_k · f_k.
 * - Accidentals (common practice, no single source): A_k = s_a,k · s_b,k · τ / t_k with τ the
 *   full coincidence window; corrected counts max(0, n_k − A_k); clipped rows are listed.
 * - Drift (our choice of model): a monitor reading m_k proportional to the pair rate during
 *   row k enters the expectation as f_k = m_k / mean(m), so σ refers to the mean monitor
 *   level and the Poisson statistics of the counts are untouched. "singles" uses the summed
 *   singles rate (s_a + s_b)/t_k as the monitor.
 */
import type { CountsRow } from "./types";

export interface CorrectionOptions {
  /** Full coincidence window in nanoseconds; turns on accidental subtraction (needs singles). */
  windowNs?: number;
  drift?: "monitor" | "singles";
}

export interface PreparedCounts {
  /** Counts the estimators see (after accidental subtraction, if any). */
  counts: Float64Array;
  /** w_k = t_k · η_k · f_k */
  weights: Float64Array;
  /** A_k per row, or null without accidental subtraction. */
  accidentals: Float64Array | null;
  /** 0-based indices of rows where n_k − A_k < 0 was clipped to 0. */
  clippedRows: number[];
  /** f_k per row, or null without drift normalisation. */
  driftFactors: Float64Array | null;
  totalCounts: number;
}

export function prepareCounts(rows: readonly CountsRow[], options: CorrectionOptions = {}): PreparedCounts {
  const k = rows.length;
  const counts = new Float64Array(k);
  const weights = new Float64Array(k);
  rows.forEach((r, i) => {
    counts[i] = checked(r.counts, i, "counts", (x) => x >= 0, "a number ≥ 0");
    const t = r.seconds === undefined ? 1 : checked(r.seconds, i, "seconds", (x) => x > 0, "a number > 0");
    const eta = r.efficiency === undefined ? 1 : checked(r.efficiency, i, "efficiency", (x) => x > 0, "a number > 0");
    weights[i] = t * eta;
  });

  let accidentals: Float64Array | null = null;
  const clippedRows: number[] = [];
  if (options.windowNs !== undefined) {
    const tau = checked(options.windowNs, -1, "windowNs", (x) => x > 0, "a number > 0") * 1e-9;
    accidentals = new Float64Array(k);
    rows.forEach((r, i) => {
      const sa = checked(r.singlesA, i, "singlesA", (x) => x >= 0, "a number ≥ 0 (needed for accidental subtraction)");
      const sb = checked(r.singlesB, i, "singlesB", (x) => x >= 0, "a number ≥ 0 (needed for accidental subtraction)");
      const a = (sa * sb * tau) / (r.seconds ?? 1);
      accidentals![i] = a;
      const corrected = counts[i] - a;
      if (corrected < 0) clippedRows.push(i);
      counts[i] = Math.max(0, corrected);
    });
  }

  let driftFactors: Float64Array | null = null;
  if (options.drift) {
    const m = rows.map((r, i) =>
      options.drift === "monitor"
        ? checked(r.monitor, i, "monitor", (x) => x > 0, "a number > 0 (needed for drift normalisation)")
        : (checked(r.singlesA, i, "singlesA", (x) => x >= 0, "a number ≥ 0 (needed for drift normalisation)") +
            checked(r.singlesB, i, "singlesB", (x) => x >= 0, "a number ≥ 0 (needed for drift normalisation)")) /
          (r.seconds ?? 1),
    );
    const mean = m.reduce((a, b) => a + b, 0) / k;
    if (!(mean > 0)) throw new Error(`field "drift": the monitor readings are all zero`);
    driftFactors = Float64Array.from(m, (x) => x / mean);
    driftFactors.forEach((f, i) => {
      if (!(f > 0)) throw new Error(`row ${i + 1}, field "${options.drift === "monitor" ? "monitor" : "singlesA"}": the drift monitor reads zero`);
      weights[i] *= f;
    });
  }

  let totalCounts = 0;
  for (let i = 0; i < k; i++) totalCounts += counts[i];
  return { counts, weights, accidentals, clippedRows, driftFactors, totalCounts };
}

function checked(value: number | undefined, row: number, field: string, ok: (x: number) => boolean, what: string): number {
  if (typeof value !== "number" || !Number.isFinite(value) || !ok(value)) {
    const where = row < 0 ? `field "${field}"` : `row ${row + 1}, field "${field}"`;
    throw new Error(`${where}: ${value === undefined ? "missing" : JSON.stringify(value)} — expected ${what}`);
  }
  return value;
}
