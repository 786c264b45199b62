/**
 * Monte Carlo uncertainties (physics.md §5) and the seeded random numbers behind them.
 */
import { afterAll, describe, expect, it } from "vitest";
import { monteCarlo, monteCarloBlock, reconstruct, simulateCounts, standardSet, summariseMonteCarlo, poisson, randomStream } from "@shared/physics";
import { logFactorial } from "@shared/physics/random";
import { MonteCarloPool } from "../../server/workers/monteCarloPool";
import { werner } from "./support/states";

describe("Poisson variates: mean = variance = λ (the defining property of the Poisson law)", () => {
  for (const lambda of [0.3, 4, 9.5, 10, 37, 2500]) {
    it(`λ = ${lambda} (${lambda < 10 ? "Knuth multiplication" : "Hörmann PTRS"})`, () => {
      const rng = randomStream(1000 + lambda);
      const n = 40_000;
      let s = 0;
      let s2 = 0;
      let p0 = 0;
      let bad = 0;
      for (let i = 0; i < n; i++) {
        const k = poisson(lambda, rng);
        if (!(Number.isInteger(k) && k >= 0)) bad++;
        s += k;
        s2 += k * k;
        if (k === 0) p0++;
      }
      expect(bad).toBe(0);
      const mean = s / n;
      const variance = s2 / n - mean * mean;
      // 5 standard errors: σ(mean) = √(λ/n), σ(var) ≈ λ √(2/n) (+ excess kurtosis 1/λ)
      expect(Math.abs(mean - lambda)).toBeLessThan(5 * Math.sqrt(lambda / n));
      expect(Math.abs(variance - lambda)).toBeLessThan(5 * lambda * Math.sqrt((2 + 1 / lambda) / n));
      const q = Math.exp(-lambda);
      expect(Math.abs(p0 / n - q)).toBeLessThan(5 * Math.sqrt((q * (1 - q)) / n) + 1e-12);
    });
  }
  it("ln k! matches the exact sum (Stirling series above 15)", () => {
    for (const k of [0, 1, 5, 15, 16, 40, 200]) {
      let exact = 0;
      for (let i = 2; i <= k; i++) exact += Math.log(i);
      expect(logFactorial(k)).toBeCloseTo(exact, 10);
    }
  });
});

describe("Monte Carlo", () => {
  const rows = simulateCounts({ rho: werner(0.9), settings: standardSet("tomo16").labels, pairRate: 2000, seed: 3 });
  const input = { rows };

  it("reproduces exactly with the same seed, differs with another", () => {
    const a = monteCarlo(input, { method: "mle" }, { samples: 40, seed: 99, target: "psi-" });
    const b = monteCarlo(input, { method: "mle" }, { samples: 40, seed: 99, target: "psi-" });
    const c = monteCarlo(input, { method: "mle" }, { samples: 40, seed: 100, target: "psi-" });
    expect(b).toEqual(a);
    expect(c.std.fidelity).not.toEqual(a.std.fidelity);
    expect(a.seed).toBe(99);
    expect(a.samples).toBe(40);
  });

  it("splitting the samples into blocks gives bit-identical results (what the worker pool relies on)", () => {
    const base = reconstruct(input, { method: "mle" });
    const whole = monteCarloBlock(input, { method: "mle" }, base.expectedCounts, 7, 0, 30, "psi-");
    const parts = [monteCarloBlock(input, { method: "mle" }, base.expectedCounts, 7, 20, 10, "psi-"), monteCarloBlock(input, { method: "mle" }, base.expectedCounts, 7, 0, 20, "psi-")];
    expect(summariseMonteCarlo(parts, 7, "mle")).toEqual(summariseMonteCarlo([whole], 7, "mle"));
  });

  it("for linear inversion agrees with first-order Poisson error propagation (Var n_k = μ_k; James et al. 2001, §VI)", () => {
    // σ_ij is linear in the counts; with large counts the normalisation by Tr σ is nearly constant.
    // Propagate numerically: ∂ρ/∂n_k by finite differences, then Var ρ_ij = Σ_k (∂ρ_ij/∂n_k)² μ_k.
    const big = simulateCounts({ rho: werner(0.8), settings: standardSet("tomo36").labels, pairRate: 2e5, seed: 4 });
    const base = reconstruct({ rows: big }, { method: "linear" });
    const mc = monteCarlo({ rows: big }, { method: "linear" }, { samples: 2000, seed: 5 }, base);
    const variance = base.rho.re.map((r) => r.map(() => 0));
    big.forEach((row, k) => {
      const h = 1;
      const bumped = big.map((r, j) => (j === k ? { ...r, counts: r.counts + h } : r));
      const rho2 = reconstruct({ rows: bumped }, { method: "linear" }).rho;
      rho2.re.forEach((r, i) => r.forEach((x, j) => (variance[i][j] += ((x - base.rho.re[i][j]) / h) ** 2 * base.expectedCounts[k])));
    });
    for (const [i, j] of [[0, 0], [1, 1], [1, 2], [0, 3]]) {
      const predicted = Math.sqrt(variance[i][j]);
      // 2000 samples: the standard deviation itself is known to ±1.6 % (1/√(2·2000)); allow 8 %
      expect(Math.abs(mc.std.rho.re[i][j] / predicted - 1)).toBeLessThan(0.08);
    }
  });

  it("rejects a sample count outside 2 … 10 000", () => {
    expect(() => monteCarlo(input, { method: "mle" }, { samples: 1, seed: 1 })).toThrow(/samples/);
    expect(() => monteCarlo(input, { method: "mle" }, { samples: 10_001, seed: 1 })).toThrow(/samples/);
  });
});

describe("the worker pool (server/workers)", () => {
  const pool = new MonteCarloPool(2);
  afterAll(() => pool.close());

  it("gives the same numbers as the single-thread run for the same seed", async () => {
    const rows = simulateCounts({ rho: werner(0.95), settings: standardSet("tomo36").labels, pairRate: 1500, seed: 8 });
    const options = { method: "mle" as const };
    const base = reconstruct({ rows }, options);
    const single = monteCarlo({ rows }, options, { samples: 64, seed: 2024, target: "psi-" }, base);
    const pooled = await pool.run({ rows }, options, { samples: 64, seed: 2024, target: "psi-" }, base);
    expect(pooled).toEqual(single);
    expect(pooled.std.fidelity).toBeGreaterThan(0);
  }, 60_000);

  it("passes engine input errors back as errors", async () => {
    const rows = ["HH", "HV", "VH", "VV"].map((setting) => ({ setting, counts: 10 }));
    await expect(pool.run({ rows }, { method: "mle" }, { samples: 4, seed: 1 }, reconstructStub(rows.length))).rejects.toThrow(/not informationally complete/);
  }, 60_000);
});

/** A fitted result for rows the engine itself would refuse (so that the workers see the refusal). */
function reconstructStub(rows: number) {
  return { expectedCounts: new Array(rows).fill(10) } as unknown as ReturnType<typeof reconstruct>;
}
