/**
 * Estimators (physics.md §3–4): exact recovery from noiseless counts, the properties that
 * define a maximum-likelihood estimate, corrections, and refusal of incomplete sets.
 */
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import * as math from "mathjs";
import { anglesForLetter, LETTERS, reconstruct, simulateCounts, standardSet, type CountsRow, type DensityMatrix, type ArmCalibration } from "@shared/physics";
import { projectEigenvalues } from "@shared/physics/projectedLeastSquares";
import { fromPlain } from "@shared/physics/linalg/complexMatrix";
import { uhlmannFidelity } from "@shared/physics/fidelity";
import { arbitraryState, ginibre, maxAbsDiff, werner } from "./support/states";
import { randomStream } from "@shared/physics/random";

const randomState = (d: number, seed: number, rank = d) => {
  const rng = randomStream(seed);
  return ginibre(Array.from({ length: 2 * d * rank }, () => rng.uniform() * 2 - 1), d, rank);
};

/** L = Σ [n ln μ − μ] of a unit-trace ρ at its best scale, computed independently of the engine. */
function logLikelihoodAt(rows: CountsRow[], rho: DensityMatrix): number {
  const m = math.matrix(rho.re.map((r, i) => r.map((x, j) => math.complex(x, rho.im[i][j]))));
  const probs = rows.map((row) => {
    const letters = (row.setting as string).split("");
    const vec = letters
      .map((l) => ({ H: [1, 0], V: [0, 1], D: [1, 1], A: [1, -1], R: [1, math.complex(0, 1)], L: [1, math.complex(0, -1)] })[l]!)
      .reduce((acc: unknown, v) => math.kron(acc as math.Matrix, math.matrix(v as number[])) as unknown, math.matrix([1]));
    const psi = math.divide(vec as math.Matrix, math.norm(vec as math.Matrix) as number) as math.Matrix;
    // math.dot(x, y) = Σ conj(x_i) y_i (mathjs conjugates its first argument)
    const value = math.dot(psi, math.multiply(m, psi) as math.Matrix) as unknown as math.Complex | number;
    return (typeof value === "number" ? value : value.re) * (row.seconds ?? 1);
  });
  const n = rows.map((r) => r.counts);
  const s = n.reduce((a, b) => a + b, 0) / probs.reduce((a, b) => a + b, 0);
  return n.reduce((acc, nk, k) => acc + (nk > 0 ? nk * Math.log(s * probs[k]) : 0) - s * probs[k], 0);
}

describe("linear inversion of noiseless counts reproduces the state (James et al., PRA 64, 052312 (2001), §III)", () => {
  const cases: [string, number, string[]][] = [
    ["tomo16 (James et al.'s 16 settings)", 2, standardSet("tomo16").labels],
    ["tomo36", 2, standardSet("tomo36").labels],
    ["pairs9 (two detectors per arm)", 2, standardSet("pairs9").labels],
    ["one photon, 4 settings", 1, standardSet("qubit4").labels],
    ["three photons, 4³ settings", 3, standardSet("product4", 3).labels],
    ["four photons, 4⁴ settings", 4, standardSet("product4", 4).labels],
  ];
  for (const [name, photons, settings] of cases) {
    it(name, () => {
      const rho = randomState(2 ** photons, 100 + photons);
      const rows = simulateCounts({ rho, settings, pairRate: 1e4, seed: 1, noiseless: true });
      const r = reconstruct({ rows }, { method: "linear" });
      expect(maxAbsDiff(r.rho, rho)).toBeLessThan(1e-11);
      expect(r.pairRate).toBeCloseTo(1e4, 6);
    });
  }

  it("waveplate-angle rows with calibrated plates: projectors computed independently with mathjs Jones matrices", () => {
    const cal: ArmCalibration[] = [
      { qwp: { fastAxisOffsetDeg: 1.5, retardanceErrorDeg: 4 }, hwp: { fastAxisOffsetDeg: -0.8, retardanceErrorDeg: -3 } },
      { qwp: { fastAxisOffsetDeg: -2, retardanceErrorDeg: -5 }, hwp: { fastAxisOffsetDeg: 0.6, retardanceErrorDeg: 2 } },
    ];
    const rng = randomStream(77);
    const angles = Array.from({ length: 30 }, () => [0, 1].map(() => ({ qwpDeg: rng.uniform() * 180 - 90, hwpDeg: rng.uniform() * 180 - 90 })));
    const deg = Math.PI / 180;
    // W(θ, δ) = R(−θ)·diag(1, e^{iδ})·R(θ), R(θ) = [[cos θ, sin θ], [−sin θ, cos θ]]; |a⟩ = (W_h W_q)†|H⟩
    const rot = (t: number) => math.matrix([[Math.cos(t), Math.sin(t)], [-Math.sin(t), Math.cos(t)]]);
    const plate = (t: number, delta: number) => math.multiply(math.multiply(rot(-t), math.matrix([[1, 0], [0, math.exp(math.complex(0, delta))]])), rot(t));
    const analysed = (a: { qwpDeg: number; hwpDeg: number }, c: ArmCalibration) => {
      const q = plate((a.qwpDeg + c.qwp!.fastAxisOffsetDeg!) * deg, (90 + c.qwp!.retardanceErrorDeg!) * deg);
      const h = plate((a.hwpDeg + c.hwp!.fastAxisOffsetDeg!) * deg, (180 + c.hwp!.retardanceErrorDeg!) * deg);
      return math.multiply(math.ctranspose(math.multiply(h, q)), math.matrix([1, 0])) as math.Matrix;
    };
    const rho = randomState(4, 5);
    const m = math.matrix(rho.re.map((r, i) => r.map((x, j) => math.complex(x, rho.im[i][j]))));
    const rows: CountsRow[] = angles.map((pair) => {
      const psi = math.kron(analysed(pair[0], cal[0]), analysed(pair[1], cal[1])) as math.Matrix;
      const p = math.dot(psi, math.multiply(m, psi) as math.Matrix) as unknown as math.Complex;
      return { setting: pair, counts: 5000 * math.complex(p).re };
    });
    const r = reconstruct({ rows, conventions: { calibration: cal } }, { method: "linear" });
    expect(maxAbsDiff(r.rho, rho)).toBeLessThan(1e-11);
  });

  it("label rows with calibrated plates use the setting sheet's angles (both PBS ports on arm B)", () => {
    // Retardance errors on both of arm B's plates: R and L can no longer be reached exactly.
    const cal: ArmCalibration[] = [{ qwp: { fastAxisOffsetDeg: 2 } }, { qwp: { retardanceErrorDeg: 4 }, hwp: { fastAxisOffsetDeg: -1.5, retardanceErrorDeg: -3 } }];
    const conventions = { calibration: cal, bothPorts: [false, true] };
    const rho = randomState(4, 9);
    const labels = standardSet("tomo36").labels;
    // The same rows written as the angles a student turns: arm B measures V, A, L at the reflected port of H, D, R.
    const table = [0, 1].map((arm) => new Map(LETTERS.map((l) => [l, anglesForLetter(l, "R=H+iV", cal[arm])])));
    const partner: Record<string, [string, boolean]> = { H: ["H", false], V: ["H", true], D: ["D", false], A: ["D", true], R: ["R", false], L: ["R", true] };
    const angleRows = labels.map((label) =>
      label.split("").map((l, arm) => {
        const [turned, reflected] = arm === 1 ? partner[l] : [l, false];
        const a = table[arm].get(turned as (typeof LETTERS)[number])!;
        return { qwpDeg: a.qwpDeg, hwpDeg: a.hwpDeg, port: reflected ? ("reflected" as const) : ("transmitted" as const) };
      }),
    );
    const byLabel = simulateCounts({ rho, settings: labels, pairRate: 1e6, seed: 2, noiseless: true, conventions });
    const byAngles = simulateCounts({ rho, settings: angleRows, pairRate: 1e6, seed: 2, noiseless: true, conventions });
    byLabel.forEach((row, k) => expect(row.counts).toBeCloseTo(byAngles[k].counts, 6));
    // the calibrated projectors differ from the ideal letters …
    const ideal = simulateCounts({ rho, settings: labels, pairRate: 1e6, seed: 2, noiseless: true });
    expect(Math.max(...ideal.map((row, k) => Math.abs(row.counts - byLabel[k].counts)))).toBeGreaterThan(1);
    // … so ignoring the calibration biases ρ, while using it recovers ρ exactly
    expect(maxAbsDiff(reconstruct({ rows: byLabel }, { method: "linear" }).rho, rho)).toBeGreaterThan(1e-6);
    expect(maxAbsDiff(reconstruct({ rows: byLabel, conventions }, { method: "linear" }).rho, rho)).toBeLessThan(1e-11);
  });

  it("exposures, detector-pair efficiencies and a drift monitor enter the expectation, not the counts", () => {
    const rho = randomState(4, 21);
    const settings = standardSet("tomo36").labels;
    const seconds = settings.map((_, k) => 0.5 + (k % 5));
    const efficiencies = settings.map((_, k) => 0.8 + 0.01 * k);
    const drift = settings.map((_, k) => 1 + 0.2 * Math.sin(k));
    const rows = simulateCounts({ rho, settings, pairRate: 2000, seconds, efficiencies, seed: 3, noiseless: true }).map((row, k) => ({
      ...row,
      counts: row.counts * drift[k],
      monitor: 7 * drift[k],
    }));
    const r = reconstruct({ rows }, { method: "linear", drift: "monitor" });
    expect(maxAbsDiff(r.rho, rho)).toBeLessThan(1e-11);
    expect(r.driftFactors!.reduce((a, b) => a + b, 0) / 36).toBeCloseTo(1, 12);
  });
});

describe("accidental subtraction A = s_a s_b τ / t (common practice, no single source)", () => {
  it("recovers the state from counts that include accidentals; raw counts are left as they were", () => {
    const rho = werner(0.9);
    const rows = simulateCounts({ rho, settings: standardSet("tomo16").labels, pairRate: 20000, seconds: 2, seed: 4, noiseless: true, singles: { rateA: 3e5, rateB: 2.5e5, windowNs: 3 } });
    const raw = rows.map((r) => r.counts);
    const r = reconstruct({ rows }, { method: "linear", windowNs: 3 });
    expect(maxAbsDiff(r.rho, rho)).toBeLessThan(1e-11);
    // A = (3e5·2)(2.5e5·2)·3e-9 / 2 = 450 counts per row
    r.accidentals!.forEach((a) => expect(a).toBeCloseTo(450, 9));
    expect(rows.map((x) => x.counts)).toEqual(raw);
    expect(r.clippedRows).toBe(0);
  });

  it("clips n − A < 0 to zero and counts the clipped rows", () => {
    const rows = simulateCounts({ rho: werner(1), settings: standardSet("tomo16").labels, pairRate: 1000, seed: 5, singles: { rateA: 1e6, rateB: 1e6, windowNs: 3 } });
    // HH and VV of ψ⁻ have no true coincidences; with A ≈ 3000 some rows fall below
    const r = reconstruct({ rows }, { method: "mle", windowNs: 3 });
    const expected = rows.filter((row) => row.counts - (row.singlesA! * row.singlesB! * 3e-9) / 1 < 0).length;
    expect(expected).toBeGreaterThan(0);
    expect(r.clippedRows).toBe(expected);
    expect(r.correctedCounts.filter((c) => c === 0)).toHaveLength(expected);
  });

  it("needs singles on every row", () => {
    const rows: CountsRow[] = standardSet("tomo16").labels.map((setting) => ({ setting, counts: 10 }));
    expect(() => reconstruct({ rows }, { method: "linear", windowNs: 3 })).toThrow(/row 1, field "singlesA"/);
  });
});

describe("informationally incomplete sets give a clear error, never a silent answer", () => {
  it("the four H/V products cannot see coherences", () => {
    const rows: CountsRow[] = ["HH", "HV", "VH", "VV"].map((setting) => ({ setting, counts: 100 }));
    expect(() => reconstruct({ rows }, { method: "mle" })).toThrow(/not informationally complete.*only 4 of the 16/);
  });
  it("the 16 products of H, V, D, A miss every σ_y component", () => {
    const rows: CountsRow[] = ["H", "V", "D", "A"].flatMap((a) => ["H", "V", "D", "A"].map((b) => ({ setting: a + b, counts: 100 })));
    expect(() => reconstruct({ rows }, { method: "linear" })).toThrow(/Pauli components IY, XY, YI/);
  });
});

describe("maximum likelihood (Poisson, positive semidefinite σ)", () => {
  it("is the linear inversion when that is already physical on the square 16-setting system (μ_k = n_k is attainable)", () => {
    const rows = simulateCounts({ rho: werner(0.5), settings: standardSet("tomo16").labels, pairRate: 1e5, seed: 8 });
    const lin = reconstruct({ rows }, { method: "linear" });
    expect(lin.physical).toBe(true);
    const mle = reconstruct({ rows }, { method: "mle" });
    expect(maxAbsDiff(mle.rho, lin.rho)).toBeLessThan(1e-9);
  });

  it("no physical state has a higher likelihood (fast-check, random states; L computed independently with mathjs)", () => {
    const rows = simulateCounts({ rho: werner(0.97), settings: standardSet("tomo16").labels, pairRate: 3000, seed: 12 });
    const mle = reconstruct({ rows }, { method: "mle" });
    expect(mle.converged).toBe(true);
    const best = logLikelihoodAt(rows, mle.rho);
    expect(best).toBeCloseTo(mle.logLikelihood!, 6);
    fc.assert(
      fc.property(arbitraryState(4), fc.double({ min: 0, max: 1, noNaN: true }), (other, t) => {
        // random states, and mixtures of them with the optimum (probes its neighbourhood)
        const mix = { re: other.re.map((r, i) => r.map((x, j) => t * x + (1 - t) * mle.rho.re[i][j])), im: other.im.map((r, i) => r.map((x, j) => t * x + (1 - t) * mle.rho.im[i][j])) };
        expect(logLikelihoodAt(rows, other)).toBeLessThanOrEqual(best + 1e-6);
        expect(logLikelihoodAt(rows, mix)).toBeLessThanOrEqual(best + 1e-6);
      }),
      { numRuns: 100, seed: 31 },
    );
  });

  it("fitted total equals measured total at the optimum, and the certificate is within the tolerance", () => {
    for (const seed of [1, 2, 3]) {
      const rows = simulateCounts({ rho: randomState(4, seed, 2), settings: standardSet("tomo36").labels, pairRate: 500 * seed, seed });
      const r = reconstruct({ rows }, { method: "mle" });
      const fitted = r.expectedCounts.reduce((a, b) => a + b, 0);
      expect(fitted / r.totalCounts).toBeCloseTo(1, 12);
      expect(r.converged).toBe(true);
      expect(r.optimalityGap!).toBeLessThanOrEqual(r.tolerance! * r.totalCounts);
      expect(r.eigenvalues.at(-1)!).toBeGreaterThan(-1e-12);
    }
  });

  it("rows with zero counts contribute μ_k alone and the optimum is still found", () => {
    const rows = simulateCounts({ rho: { re: [[1, 0, 0, 0], [0, 0, 0, 0], [0, 0, 0, 0], [0, 0, 0, 0]], im: werner(0).im }, settings: standardSet("tomo16").labels, pairRate: 400, seed: 6 });
    expect(rows.some((r) => r.counts === 0)).toBe(true);
    const r = reconstruct({ rows }, { method: "mle" });
    expect(r.converged).toBe(true);
    expect(r.rho.re[0][0]).toBeGreaterThan(0.98);
  });

  it("approaches the true state as the counts grow (consistency), including rank-deficient states", () => {
    for (const [seed, rank] of [[40, 1], [41, 2], [42, 4]]) {
      const truth = randomState(4, seed, rank);
      const infidelity = [1e2, 1e4, 1e6].map((rate) => {
        const rows = simulateCounts({ rho: truth, settings: standardSet("tomo36").labels, pairRate: rate, seed: seed + rate });
        const r = reconstruct({ rows }, { method: "mle" });
        return 1 - uhlmannFidelity(fromPlain(r.rho), fromPlain(truth));
      });
      expect(infidelity[2]).toBeLessThan(infidelity[0]);
      expect(infidelity[2]).toBeLessThan(1e-3);
    }
  });

  it("three and four photons converge with the same code", () => {
    for (const photons of [3, 4]) {
      const rows = simulateCounts({ rho: randomState(2 ** photons, photons, 2), settings: standardSet("product4", photons).labels, pairRate: 1e5, seed: photons });
      const r = reconstruct({ rows }, { method: "mle" });
      expect(r.converged).toBe(true);
      expect(r.rho.re).toHaveLength(2 ** photons);
    }
  });
});

describe("projected least squares (Smolin, Gambetta, Smith, PRL 108, 070502 (2012))", () => {
  it("their eigenvalue step is the Euclidean projection onto the probability simplex (checked against Duchi et al., ICML 2008, Fig. 1)", () => {
    const duchi = (u: number[]) => {
      const s = [...u].sort((a, b) => b - a);
      let sum = 0;
      let theta = 0;
      s.forEach((x, j) => {
        sum += x;
        if (x - (sum - 1) / (j + 1) > 0) theta = (sum - 1) / (j + 1);
      });
      return s.map((x) => Math.max(x - theta, 0));
    };
    fc.assert(
      fc.property(fc.array(fc.double({ min: -0.5, max: 1, noNaN: true }), { minLength: 2, maxLength: 16 }), (raw) => {
        const sum = raw.reduce((a, b) => a + b, 0);
        fc.pre(Math.abs(sum) > 0.1);
        const mu = raw.map((x) => x / sum).sort((a, b) => b - a);
        const ours = Array.from(projectEigenvalues(mu));
        duchi(mu).forEach((x, i) => expect(ours[i]).toBeCloseTo(x, 12));
      }),
      { numRuns: 200, seed: 17 },
    );
  });

  it("returns the linear estimate when it is physical and a physical state otherwise", () => {
    const rowsPhysical = simulateCounts({ rho: werner(0.5), settings: standardSet("tomo36").labels, pairRate: 1e5, seed: 13 });
    expect(maxAbsDiff(reconstruct({ rows: rowsPhysical }, { method: "projected" }).rho, reconstruct({ rows: rowsPhysical }, { method: "linear" }).rho)).toBeLessThan(1e-12);
    const rows = simulateCounts({ rho: werner(1), settings: standardSet("tomo16").labels, pairRate: 300, seed: 14 });
    const lin = reconstruct({ rows }, { method: "linear" });
    const proj = reconstruct({ rows }, { method: "projected" });
    expect(lin.physical).toBe(false);
    expect(proj.physical).toBe(true);
    expect(proj.eigenvalues.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 12);
  });
});
