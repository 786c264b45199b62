/**
 * Invented counts from a known state, for tests, examples and demo data: n_k ~ Poisson(μ_k + A_k)
 * with μ_k = R · t_k · η_k · Tr(ρ P_k) (R the pair rate) and, when singles are simulated,
 * accidentals A_k = r_a r_b τ t_k and singles s ~ Poisson(r t_k) (physics contract §3).
 */
import type { CountsRow, DensityMatrix, SetupConventions } from "./types";
import { buildModel } from "./measurementModel";
import { expectedCounts } from "./likelihood";
import { fromPlain } from "./linalg/complexMatrix";
import { poisson, randomStream } from "./random";

export interface SimulationOptions {
  rho: DensityMatrix;
  settings: CountsRow["setting"][];
  /** Detected pairs per second at efficiency 1 (Tr σ). */
  pairRate: number;
  /** Exposure per row (one number for all rows), seconds; default 1. */
  seconds?: number | number[];
  efficiencies?: number[];
  seed: number;
  conventions?: SetupConventions;
  /** Adds singles columns and accidental coincidences. */
  singles?: { rateA: number; rateB: number; windowNs: number };
  /** Return the exact expectations instead of Poisson draws (not whole numbers). */
  noiseless?: boolean;
}

export function simulateCounts(options: SimulationOptions): CountsRow[] {
  const model = buildModel(options.settings, options.conventions);
  const k = model.rows;
  const seconds = Array.from({ length: k }, (_, i) =>
    Array.isArray(options.seconds) ? options.seconds[i] : (options.seconds ?? 1),
  );
  const eta = Array.from({ length: k }, (_, i) => options.efficiencies?.[i] ?? 1);
  const weights = Float64Array.from(seconds, (t, i) => t * eta[i] * options.pairRate);
  const mu = expectedCounts(model, weights, fromPlain(options.rho));
  const rng = randomStream(options.seed);
  return options.settings.map((setting, i) => {
    const row: CountsRow = { setting, counts: 0 };
    if (seconds[i] !== 1 || Array.isArray(options.seconds) || options.seconds !== undefined) row.seconds = seconds[i];
    if (options.efficiencies) row.efficiency = eta[i];
    let mean = Math.max(0, mu[i]);
    if (options.singles) {
      const { rateA, rateB, windowNs } = options.singles;
      mean += rateA * rateB * windowNs * 1e-9 * seconds[i];
      row.singlesA = options.noiseless ? rateA * seconds[i] : poisson(rateA * seconds[i], rng);
      row.singlesB = options.noiseless ? rateB * seconds[i] : poisson(rateB * seconds[i], rng);
    }
    row.counts = options.noiseless ? mean : poisson(mean, rng);
    return row;
  });
}
