/**
 * CHSH from measured coincidences (physics contract §7).
 *
 * E(α, β) = (C(α,β) + C(α⊥,β⊥) − C(α,β⊥) − C(α⊥,β)) / (sum of the four),
 * S = E(a,b) − E(a,b′) + E(a′,b) + E(a′,b′)
 * (Clauser, Horne, Shimony, Holt, PRL 23, 880 (1969)). Each count is first divided by its
 * exposure, so rows taken for different times compare as rates (common practice, no source).
 *
 * Uncertainty: first-order propagation of independent Poisson counts, Var(n) ≈ n (common
 * practice, no source). With rates r_i = n_i/t_i and signs s_i = ±1,
 * ∂E/∂r_i = (s_i − E)/Σr, so Var E = Σ_i (s_i − E)² n_i/t_i² / (Σr)²; for equal exposures
 * this is (1 − E²)/N. The four correlations use sixteen distinct rows, so Var S = Σ Var E.
 * Significance (|S| − 2)/σ_S counts standard deviations beyond the local-realist bound 2.
 */
import { EngineInputError } from "../errors";
import { type BellAngles, type SettingPairName, sameAnalyser, settingPairs } from "./angles";

/** One measured row of a Bell test: the polariser angle of each arm and its coincidences. */
export interface BellRow {
  angleADeg: number;
  angleBDeg: number;
  counts: number;
  /** Exposure in seconds (default 1). */
  seconds?: number;
}

/** The four outcomes of one analyser pair (counts and exposures). */
export interface OutcomeQuad {
  /** C(α,β), C(α⊥,β⊥), C(α,β⊥), C(α⊥,β) */
  counts: [number, number, number, number];
  seconds: [number, number, number, number];
}

const OUTCOME_SIGNS = [1, 1, -1, -1] as const;

export interface Correlation {
  value: number;
  sigma: number;
  /** Raw coincidences summed over the four outcomes. */
  totalCounts: number;
}

/** E(α, β) and σ_E from the four outcomes of one analyser pair (formulas in the file header). */
export function correlation(quad: OutcomeQuad): Correlation {
  const rates = quad.counts.map((n, i) => n / quad.seconds[i]);
  const total = rates.reduce((s, r) => s + r, 0);
  const totalCounts = quad.counts.reduce((s, n) => s + n, 0);
  if (!(total > 0)) throw new EngineInputError("no_counts", "all four outcomes have zero counts, so E is undefined");
  const value = rates.reduce((s, r, i) => s + OUTCOME_SIGNS[i] * r, 0) / total;
  let variance = 0;
  quad.counts.forEach((n, i) => {
    variance += (OUTCOME_SIGNS[i] - value) ** 2 * (n / quad.seconds[i] ** 2);
  });
  return { value, sigma: Math.sqrt(variance) / total, totalCounts };
}

export interface PairCorrelation extends Correlation {
  name: SettingPairName;
  alphaDeg: number;
  betaDeg: number;
  sign: 1 | -1;
  /** 0-based indices of the rows used, in the order C(α,β), C(α⊥,β⊥), C(α,β⊥), C(α⊥,β). */
  rows: [number, number, number, number];
}

export interface ChshResult {
  angles: BellAngles;
  correlations: PairCorrelation[];
  s: number;
  sigmaS: number;
  /** (|S| − 2)/σ_S */
  significance: number;
  totalCounts: number;
}

/** S ± σ_S from the sixteen rows of a Bell test at the given angles. */
export function chshFromRows(rows: readonly BellRow[], angles: BellAngles): ChshResult {
  rows.forEach(checkRow);
  const correlations = settingPairs(angles).map((pair): PairCorrelation => {
    const { alphaDeg: a, betaDeg: b } = pair;
    const wanted: [number, number][] = [[a, b], [a + 90, b + 90], [a, b + 90], [a + 90, b]];
    const found = wanted.map(([x, y]) => findRow(rows, x, y, pair.name)) as PairCorrelation["rows"];
    const quad: OutcomeQuad = {
      counts: found.map((i) => rows[i].counts) as OutcomeQuad["counts"],
      seconds: found.map((i) => rows[i].seconds ?? 1) as OutcomeQuad["seconds"],
    };
    return { ...pair, ...correlation(quad), rows: found };
  });
  const s = correlations.reduce((sum, c) => sum + c.sign * c.value, 0);
  const sigmaS = Math.sqrt(correlations.reduce((sum, c) => sum + c.sigma ** 2, 0));
  return {
    angles,
    correlations,
    s,
    sigmaS,
    significance: sigmaS > 0 ? (Math.abs(s) - 2) / sigmaS : Number.NaN,
    totalCounts: correlations.reduce((sum, c) => sum + c.totalCounts, 0),
  };
}

function checkRow(row: BellRow, i: number): void {
  const where = `row ${i + 1}`;
  if (!Number.isFinite(row.angleADeg)) throw new EngineInputError("invalid_input", `${where}: angleADeg must be a number`);
  if (!Number.isFinite(row.angleBDeg)) throw new EngineInputError("invalid_input", `${where}: angleBDeg must be a number`);
  if (!(Number.isFinite(row.counts) && row.counts >= 0)) throw new EngineInputError("invalid_input", `${where}: counts must be a number ≥ 0`);
  if (row.seconds !== undefined && !(row.seconds > 0)) throw new EngineInputError("invalid_input", `${where}: seconds must be a number > 0`);
}

function findRow(rows: readonly BellRow[], alphaDeg: number, betaDeg: number, pair: SettingPairName): number {
  const matches = rows.flatMap((r, i) => (sameAnalyser(r.angleADeg, alphaDeg) && sameAnalyser(r.angleBDeg, betaDeg) ? [i] : []));
  const label = `A ${normalise(alphaDeg)}°, B ${normalise(betaDeg)}° (needed for E(${pair}))`;
  if (matches.length === 0) throw new EngineInputError("invalid_input", `no row was measured at ${label}`);
  if (matches.length > 1) {
    throw new EngineInputError("invalid_input", `rows ${matches.map((i) => i + 1).join(" and ")} were both measured at ${label}; keep one`);
  }
  return matches[0];
}

function normalise(deg: number): number {
  const a = ((deg % 180) + 180) % 180;
  return Math.round(a * 1e6) / 1e6;
}
