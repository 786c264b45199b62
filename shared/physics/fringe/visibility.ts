/**
 * Visibility from the raw extremes of a fringe, V = (C_max − C_min)/(C_max + C_min)
 * (physics contract §7), on exposure-normalised rates r = n/t and without background
 * subtraction. σ_V by first-order Poisson propagation (common practice, no source):
 * ∂V/∂r_max = 2 r_min/(r_max + r_min)², ∂V/∂r_min = −2 r_max/(r_max + r_min)², Var r = n/t².
 * Also: which basis a scan belongs to, and the visibilities collected per basis.
 */
import { EngineInputError } from "../errors";
import type { FringePoint } from "./fit";

export interface ExtremesVisibility {
  visibility: number;
  sigma: number;
  /** 0-based indices of the rows with the highest and lowest rate. */
  maxRow: number;
  minRow: number;
}

export function visibilityFromExtremes(points: readonly FringePoint[]): ExtremesVisibility {
  if (points.length < 2) throw new EngineInputError("invalid_input", "the raw visibility needs at least two rows");
  const rates = points.map((p) => p.counts / (p.seconds ?? 1));
  const maxRow = rates.indexOf(Math.max(...rates));
  const minRow = rates.indexOf(Math.min(...rates));
  const hi = rates[maxRow];
  const lo = rates[minRow];
  if (!(hi > 0)) throw new EngineInputError("no_counts", "every row has zero counts, so the visibility is undefined");
  const varHi = points[maxRow].counts / (points[maxRow].seconds ?? 1) ** 2;
  const varLo = points[minRow].counts / (points[minRow].seconds ?? 1) ** 2;
  const d = (hi + lo) ** 2;
  const sigma = Math.sqrt(((2 * lo) / d) ** 2 * varHi + ((2 * hi) / d) ** 2 * varLo);
  return { visibility: (hi - lo) / (hi + lo), sigma, maxRow, minRow };
}

/** H/V when the fixed arm analyses H or V, D/A when it analyses D or A (angles modulo 180°). */
export type FringeBasis = "HV" | "DA" | "other";

export const BASIS_TOLERANCE_DEG = 0.5;

export function fringeBasis(fixedArmAngleDeg: number): FringeBasis {
  const a = ((fixedArmAngleDeg % 90) + 90) % 90;
  const near = (x: number) => Math.abs(a - x) <= BASIS_TOLERANCE_DEG;
  if (near(0) || near(90)) return "HV";
  if (near(45)) return "DA";
  return "other";
}

export interface BasisVisibility {
  basis: FringeBasis;
  scans: number;
  /** Inverse-variance weighted mean of the scans' fitted visibilities (common practice). */
  visibility: number;
  sigma: number;
}

/** Collects fitted visibilities per basis. */
export function visibilitiesByBasis(scans: readonly { basis: FringeBasis; visibility: number; sigma: number }[]): BasisVisibility[] {
  const order: FringeBasis[] = ["HV", "DA", "other"];
  return order.flatMap((basis) => {
    const group = scans.filter((s) => s.basis === basis);
    if (group.length === 0) return [];
    if (group.some((s) => !(s.sigma > 0))) {
      const v = group.reduce((sum, s) => sum + s.visibility, 0) / group.length;
      return [{ basis, scans: group.length, visibility: v, sigma: Number.NaN }];
    }
    const w = group.map((s) => 1 / s.sigma ** 2);
    const wsum = w.reduce((a, b) => a + b, 0);
    const v = group.reduce((sum, s, i) => sum + w[i] * s.visibility, 0) / wsum;
    return [{ basis, scans: group.length, visibility: v, sigma: Math.sqrt(1 / wsum) }];
  });
}
