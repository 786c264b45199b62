import { describe, expect, it } from "vitest";
import { poisson, randomStream } from "@shared/physics/random";
import {
  type BellAngles,
  type BellRow,
  STANDARD_BELL_ANGLES,
  chshFromRows,
  correlation,
  predictedChsh,
  predictedCorrelation,
  settingPairs,
} from "@shared/physics/bell";
import type { DensityMatrix } from "@shared/physics/types";

const S = Math.SQRT1_2;
const PHI_PLUS: DensityMatrix = pure([S, 0, 0, S]);
const PSI_MINUS: DensityMatrix = pure([0, S, -S, 0]);

function pure(v: number[]): DensityMatrix {
  return { re: v.map((a) => v.map((b) => a * b)), im: v.map(() => v.map(() => 0)) };
}

function werner(p: number): DensityMatrix {
  const psi = pure([0, S, -S, 0]);
  return {
    re: psi.re.map((row, i) => row.map((x, j) => p * x + (i === j ? (1 - p) / 4 : 0))),
    im: psi.im,
  };
}

/** Probability that a pair passes polarisers at α (A) and β (B): Tr(ρ |α⟩⟨α| ⊗ |β⟩⟨β|). */
function passProbability(rho: DensityMatrix, alphaDeg: number, betaDeg: number): number {
  const a = [Math.cos((alphaDeg * Math.PI) / 180), Math.sin((alphaDeg * Math.PI) / 180)];
  const b = [Math.cos((betaDeg * Math.PI) / 180), Math.sin((betaDeg * Math.PI) / 180)];
  const v = [a[0] * b[0], a[0] * b[1], a[1] * b[0], a[1] * b[1]];
  let p = 0;
  for (let i = 0; i < 4; i++) for (let j = 0; j < 4; j++) p += v[i] * rho.re[i][j] * v[j];
  return p;
}

/** The sixteen rows a Bell test at `angles` records, with expected (noiseless) counts. */
function expectedRows(rho: DensityMatrix, angles: BellAngles, pairs: number, seconds = 1): BellRow[] {
  return settingPairs(angles).flatMap(({ alphaDeg: a, betaDeg: b }) =>
    [[a, b], [a + 90, b + 90], [a, b + 90], [a + 90, b]].map(([x, y]) => ({
      angleADeg: x,
      angleBDeg: y,
      counts: pairs * seconds * passProbability(rho, x, y),
      seconds,
    })),
  );
}

function rounded(rows: BellRow[]): BellRow[] {
  return rows.map((r) => ({ ...r, counts: Math.round(r.counts) }));
}

/** Poisson draws from the engine's seeded generator. */
function poissonSampler(seed: number): (mean: number) => number {
  const rng = randomStream(seed);
  return (mean) => poisson(mean, rng);
}

describe("CHSH from counts", () => {
  it("gives 2√2 for φ⁺ at the standard angles from noiseless expected counts (Clauser et al., PRL 23, 880 (1969); Tsirelson bound, Lett. Math. Phys. 4, 93 (1980))", () => {
    const result = chshFromRows(expectedRows(PHI_PLUS, STANDARD_BELL_ANGLES, 10_000), STANDARD_BELL_ANGLES);
    expect(result.s).toBeCloseTo(2 * Math.SQRT2, 12);
    // Each correlation of φ⁺ is cos 2(α − β) (follows from the definition); at these angles ±1/√2.
    expect(result.correlations.map((c) => c.value)).toEqual([S, -S, S, S].map((x) => expect.closeTo(x, 12)));
  });

  it("gives S = 2√2·p for a Werner state at its optimal angles (Werner, PRA 40, 4277 (1989))", () => {
    // The Werner state is built on ψ⁻, for which the standard angles are optimal with S < 0
    // (E = −cos 2(α − β) follows from the definition), so |S| = 2√2·p.
    for (const p of [1, 0.9, 0.75, 0.5, 0.2]) {
      const result = chshFromRows(expectedRows(werner(p), STANDARD_BELL_ANGLES, 1e6), STANDARD_BELL_ANGLES);
      expect(result.s).toBeCloseTo(-2 * Math.SQRT2 * p, 10);
    }
  });

  it("normalises each row by its exposure", () => {
    const rows = expectedRows(PHI_PLUS, STANDARD_BELL_ANGLES, 5000);
    const stretched = rows.map((r, i) => (i % 3 === 0 ? { ...r, counts: r.counts * 4, seconds: 4 } : r));
    expect(chshFromRows(stretched, STANDARD_BELL_ANGLES).s).toBeCloseTo(2 * Math.SQRT2, 12);
  });

  it("σ_E equals √((1 − E²)/N) for equal exposures (first-order Poisson propagation, common practice)", () => {
    const c = correlation({ counts: [400, 380, 60, 50], seconds: [1, 1, 1, 1] });
    const n = 890;
    const e = (400 + 380 - 60 - 50) / n;
    expect(c.value).toBeCloseTo(e, 14);
    expect(c.sigma).toBeCloseTo(Math.sqrt((1 - e * e) / n), 14);
  });

  it("σ_S matches a numerical propagation of the Poisson variances through S", () => {
    const angles: BellAngles = { aDeg: 3, aPrimeDeg: 44, bDeg: 25, bPrimeDeg: 70 };
    const rows = rounded(expectedRows(werner(0.93), angles, 8000, 2));
    const result = chshFromRows(rows, angles);
    // Var S = Σ_k (∂S/∂n_k)² n_k, with the derivative by central differences.
    let variance = 0;
    rows.forEach((row, k) => {
      const h = 1e-3;
      const plus = rows.map((r, i) => (i === k ? { ...r, counts: r.counts + h } : r));
      const minus = rows.map((r, i) => (i === k ? { ...r, counts: r.counts - h } : r));
      const ds = (sOf(plus, angles) - sOf(minus, angles)) / (2 * h);
      variance += ds * ds * row.counts;
    });
    expect(result.sigmaS).toBeCloseTo(Math.sqrt(variance), 8);
  });

  it("σ_S agrees with the spread of S over Poisson-resampled counts", () => {
    const angles = STANDARD_BELL_ANGLES;
    const means = expectedRows(werner(0.95), angles, 3000);
    const predicted = chshFromRows(rounded(means), angles).sigmaS;
    const draw = poissonSampler(20240611);
    const samples: number[] = [];
    for (let i = 0; i < 2000; i++) {
      const noisy = means.map((r) => ({ ...r, counts: draw(r.counts) }));
      samples.push(chshFromRows(noisy, angles).s);
    }
    const mean = samples.reduce((a, b) => a + b, 0) / samples.length;
    const sd = Math.sqrt(samples.reduce((a, b) => a + (b - mean) ** 2, 0) / (samples.length - 1));
    // The standard error of a standard deviation from 2000 samples is about 1.6 %; allow 6 %.
    expect(Math.abs(sd / predicted - 1)).toBeLessThan(0.06);
  });

  it("reports the significance (|S| − 2)/σ_S", () => {
    const rows = rounded(expectedRows(PHI_PLUS, STANDARD_BELL_ANGLES, 2000));
    const r = chshFromRows(rows, STANDARD_BELL_ANGLES);
    expect(r.significance).toBeCloseTo((Math.abs(r.s) - 2) / r.sigmaS, 14);
    // By hand: each analyser pair has 854 + 854 coincident and 146 + 146 anti-coincident counts
    // (2000·cos²22.5°/2 rounded), so E = ±1416/2000 and S = 4·0.708 = 2.832; Poisson
    // propagation gives σ_E² = 4·1708·292/2000³ for each E, σ_S = 2σ_E = 0.031583, and
    // (2.832 − 2)/0.031583 = 26.343 (follows from the definitions, physics.md §7).
    expect(r.s).toBeCloseTo(2.832, 12);
    expect(r.sigmaS).toBeCloseTo(0.0315828, 6);
    expect(r.significance).toBeCloseTo(26.3435, 3);
  });

  it("names the missing analyser pair and duplicated rows", () => {
    const rows = rounded(expectedRows(PHI_PLUS, STANDARD_BELL_ANGLES, 1000));
    expect(() => chshFromRows(rows.slice(1), STANDARD_BELL_ANGLES)).toThrow(/no row was measured at A 0°, B 22\.5° \(needed for E\(a,b\)\)/);
    expect(() => chshFromRows([...rows, rows[5]], STANDARD_BELL_ANGLES)).toThrow(/rows 6 and 17 were both measured/);
    expect(() => chshFromRows(rows.map((r, i) => (i === 2 ? { ...r, counts: -1 } : r)), STANDARD_BELL_ANGLES)).toThrow(/row 3: counts/);
  });

  it("treats θ and θ + 180° as the same polariser setting", () => {
    const rows = expectedRows(PHI_PLUS, STANDARD_BELL_ANGLES, 1000).map((r) => ({ ...r, angleADeg: r.angleADeg + 180 }));
    expect(chshFromRows(rows, STANDARD_BELL_ANGLES).s).toBeCloseTo(2 * Math.SQRT2, 12);
  });
});

function sOf(rows: BellRow[], angles: BellAngles): number {
  return chshFromRows(rows, angles).s;
}

describe("CHSH predicted from a density matrix", () => {
  it("φ⁺ predicts E = cos 2(α − β) and S = 2√2 at the standard angles; maximum 2√2 (Tsirelson 1980)", () => {
    expect(predictedCorrelation(PHI_PLUS, 10, 40)).toBeCloseTo(Math.cos((2 * -30 * Math.PI) / 180), 12);
    const p = predictedChsh(PHI_PLUS, STANDARD_BELL_ANGLES);
    expect(p.s).toBeCloseTo(2 * Math.SQRT2, 12);
    expect(p.maximum).toBeCloseTo(2 * Math.SQRT2, 12);
  });

  it("ψ⁻ at φ⁺'s angles predicts S = −2√2, since its E(α, β) = −cos 2(α − β) (follows from the definition)", () => {
    const e = (a: number, b: number) => -Math.cos((2 * (a - b) * Math.PI) / 180);
    const expected = e(0, 22.5) - e(0, 67.5) + e(45, 22.5) + e(45, 67.5);
    expect(expected).toBeCloseTo(-2 * Math.SQRT2, 12);
    const p = predictedChsh(PSI_MINUS, STANDARD_BELL_ANGLES);
    expect(p.s).toBeCloseTo(expected, 12);
    expect(p.maximum).toBeCloseTo(2 * Math.SQRT2, 12);
  });

  it("the Horodecki maximum of a Werner state is 2√2·p (Werner 1989; Horodecki et al., Phys. Lett. A 200, 340 (1995))", () => {
    for (const p of [1, 0.8, 0.5, 0.1]) expect(predictedChsh(werner(p), STANDARD_BELL_ANGLES).maximum).toBeCloseTo(2 * Math.SQRT2 * p, 12);
  });

  it("a product state cannot exceed 2 (local bound, Clauser et al. 1969)", () => {
    const hh = pure([1, 0, 0, 0]);
    expect(predictedChsh(hh, STANDARD_BELL_ANGLES).maximum).toBeLessThanOrEqual(2 + 1e-12);
  });

  it("agrees with counts computed from the same state at arbitrary angles", () => {
    const angles: BellAngles = { aDeg: 7, aPrimeDeg: 51, bDeg: 19, bPrimeDeg: 80 };
    const rho = werner(0.7);
    const fromCounts = chshFromRows(expectedRows(rho, angles, 1e5), angles);
    const predicted = predictedChsh(rho, angles);
    expect(predicted.s).toBeCloseTo(fromCounts.s, 12);
    predicted.correlations.forEach((c, i) => expect(c.value).toBeCloseTo(fromCounts.correlations[i].value, 12));
  });
});
