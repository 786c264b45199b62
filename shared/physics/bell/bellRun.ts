/**
 * A Bell-test run as stored (rows with labels or waveplate angles) → CHSH. Angles a, a′, b, b′
 * are the caller's; without them the standard ones are used when the rows contain them, and
 * otherwise they are read off the rows (our rule: each arm must show exactly two settings up to
 * orthogonality, and the representative in [0°, 90°) of each is taken, smaller first).
 */
import { EngineInputError } from "../errors";
import type { CountsRow } from "../types";
import { type BellAngles, STANDARD_BELL_ANGLES, sameAnalyser } from "./angles";
import { type BellRow, type ChshResult, chshFromRows } from "./chsh";
import { rowPolariserAngles } from "./settingAngles";

export type AnglesOrigin = "given" | "standard" | "fromRows";

export interface BellRunAnalysis extends ChshResult {
  anglesOrigin: AnglesOrigin;
}

export function bellRowsOf(rows: readonly CountsRow[]): BellRow[] {
  return rows.map((r, i) => {
    const [angleADeg, angleBDeg] = rowPolariserAngles(r.setting, i);
    return { angleADeg, angleBDeg, counts: r.counts, seconds: r.seconds };
  });
}

export function analyseBellRun(rows: readonly CountsRow[], angles?: BellAngles): BellRunAnalysis {
  const bellRows = bellRowsOf(rows);
  if (angles) return { ...chshFromRows(bellRows, angles), anglesOrigin: "given" };
  if (containsAngles(bellRows, STANDARD_BELL_ANGLES)) return { ...chshFromRows(bellRows, STANDARD_BELL_ANGLES), anglesOrigin: "standard" };
  return { ...chshFromRows(bellRows, anglesFromRows(bellRows)), anglesOrigin: "fromRows" };
}

function containsAngles(rows: BellRow[], angles: BellAngles): boolean {
  const hasA = (x: number) => rows.some((r) => sameAnalyser(r.angleADeg, x));
  const hasB = (x: number) => rows.some((r) => sameAnalyser(r.angleBDeg, x));
  return hasA(angles.aDeg) && hasA(angles.aPrimeDeg) && hasB(angles.bDeg) && hasB(angles.bPrimeDeg);
}

/** The two settings of each arm, as representatives in [0°, 90°) (rule in the file header). */
export function anglesFromRows(rows: readonly BellRow[]): BellAngles {
  const settings = (arm: "A" | "B") => {
    const reps: number[] = [];
    for (const r of rows) {
      const deg = arm === "A" ? r.angleADeg : r.angleBDeg;
      const rep = Math.round((((deg % 90) + 90) % 90) * 1e9) / 1e9;
      if (!reps.some((x) => sameAnalyser(x, rep) || sameAnalyser(x + 90, rep))) reps.push(rep);
    }
    if (reps.length !== 2) {
      throw new EngineInputError(
        "invalid_input",
        `arm ${arm} was set to ${reps.length} different analyser settings (counting θ and θ + 90° as one); a CHSH test needs exactly two per arm — give the angles a, a′, b, b′ explicitly`,
      );
    }
    return reps.sort((x, y) => x - y);
  };
  const [aDeg, aPrimeDeg] = settings("A");
  const [bDeg, bPrimeDeg] = settings("B");
  return { aDeg, aPrimeDeg, bDeg, bPrimeDeg };
}
