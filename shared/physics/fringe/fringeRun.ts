/**
 * A fringe-scan run as stored → one fit per setting of the fixed arm. The scanned arm is the
 * one whose analyser takes more distinct angles; rows are grouped by the fixed arm's angle
 * (modulo 180°), so one run may hold several scans (e.g. arm A at H, then at D).
 * Background: none, the accidentals of each row from its singles (A_k = s_a·s_b·τ/t_k, common
 * practice, computed by the engine's prepareCounts), or a given rate ± σ.
 */
import { prepareCounts } from "../corrections";
import { EngineInputError } from "../errors";
import type { CountsRow } from "../types";
import { sameAnalyser } from "../bell/angles";
import { rowPolariserAngles } from "../bell/settingAngles";
import { type FringeFit, type FringePoint, fitFringe } from "./fit";
import { type BasisVisibility, type ExtremesVisibility, type FringeBasis, fringeBasis, visibilitiesByBasis, visibilityFromExtremes } from "./visibility";

export type FringeBackground =
  | { kind: "none" }
  | { kind: "accidentals"; windowNs: number }
  | { kind: "rate"; perSecond: number; sigma: number };

export interface FringeScan {
  scannedArm: "A" | "B";
  fixedAngleDeg: number;
  basis: FringeBasis;
  /** 0-based row indices of this scan, in the order of `points`. */
  rows: number[];
  points: FringePoint[];
  fit: FringeFit;
  extremes: ExtremesVisibility;
}

export interface FringeRunAnalysis {
  scans: FringeScan[];
  byBasis: BasisVisibility[];
}

export function analyseFringeRun(rows: readonly CountsRow[], background: FringeBackground = { kind: "none" }): FringeRunAnalysis {
  const angles = rows.map((r, i) => rowPolariserAngles(r.setting, i));
  const accidentals = background.kind === "accidentals" ? prepareCounts(rows, { windowNs: background.windowNs }).accidentals : null;
  const distinct = (arm: 0 | 1) => new Set(angles.map((a) => Math.round(a[arm] * 1e6))).size;
  const scanned: 0 | 1 = distinct(1) >= distinct(0) ? 1 : 0;
  const fixed = (1 - scanned) as 0 | 1;

  const groups: { fixedAngleDeg: number; rows: number[] }[] = [];
  angles.forEach((a, i) => {
    const group = groups.find((g) => sameAnalyser(g.fixedAngleDeg, a[fixed]));
    if (group) group.rows.push(i);
    else groups.push({ fixedAngleDeg: a[fixed], rows: [i] });
  });

  const scans = groups.map((g): FringeScan => {
    const points = g.rows.map((i) => ({
      angleDeg: angles[i][scanned],
      counts: rows[i].counts,
      seconds: rows[i].seconds ?? 1,
      ...(accidentals ? { backgroundCounts: accidentals[i] } : {}),
    }));
    const label = `the scan with arm ${fixed === 0 ? "A" : "B"} at ${g.fixedAngleDeg}°`;
    const fit = withContext(label, g.rows, () =>
      fitFringe(points, background.kind === "rate" ? { backgroundRate: background.perSecond, backgroundRateSigma: background.sigma } : {}),
    );
    return {
      scannedArm: scanned === 0 ? "A" : "B",
      fixedAngleDeg: g.fixedAngleDeg,
      basis: fringeBasis(g.fixedAngleDeg),
      rows: g.rows,
      points,
      fit,
      extremes: withContext(label, g.rows, () => visibilityFromExtremes(points)),
    };
  });
  return { scans, byBasis: visibilitiesByBasis(scans.map((s) => ({ basis: s.basis, visibility: s.fit.visibility, sigma: s.fit.sigmaVisibility }))) };
}

/** Re-raises a fit error with the scan named and its "row k" mapped back to the run's row. */
function withContext<T>(label: string, rowIndices: number[], f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (!(e instanceof EngineInputError)) throw e;
    const message = e.message.replace(/row (\d+)/g, (_, k) => `row ${rowIndices[Number(k) - 1] + 1}`);
    throw new EngineInputError(e.code, `${label}: ${message}`);
  }
}
