import { describe, expect, it } from "vitest";
import { poisson, randomStream } from "@shared/physics/random";
import { type FringePoint, fitFringe, fringeModelRate, fringeBasis, visibilitiesByBasis, visibilityFromExtremes } from "@shared/physics/fringe";

const DEG = Math.PI / 180;
/** C(θ) = C₀[1 + V cos 2(θ − θ₀)] + B (physics contract §7, common practice). */
const model = (c0: number, v: number, phaseDeg: number, b: number) => (thetaDeg: number) =>
  c0 * (1 + v * Math.cos(2 * (thetaDeg - phaseDeg) * DEG)) + b;

function scan(rate: (t: number) => number, angles: number[], seconds = 1): FringePoint[] {
  return angles.map((angleDeg) => ({ angleDeg, counts: rate(angleDeg) * seconds, seconds }));
}

const ANGLES = Array.from({ length: 12 }, (_, i) => i * 15);

/** Poisson draws from the engine's seeded generator. */
function poissonSampler(seed: number): (mean: number) => number {
  const rng = randomStream(seed);
  return (mean) => poisson(mean, rng);
}

describe("fringe fit", () => {
  it("recovers a known visibility, phase and mean exactly from noiseless data", () => {
    for (const [v, phase] of [[0.98, 0], [0.95, 45], [0.6, -20], [0.3, 70]]) {
      const fit = fitFringe(scan(model(1500, v, phase, 0), ANGLES));
      expect(fit.visibility).toBeCloseTo(v, 10);
      expect(fit.phaseDeg).toBeCloseTo(phase, 8);
      expect(fit.c0).toBeCloseTo(1500, 8);
      expect(fit.chiSquare).toBeLessThan(1e-12);
      expect(fit.converged).toBe(true);
      for (const theta of [0, 33, 90, 151]) expect(fringeModelRate(fit, theta)).toBeCloseTo(model(1500, v, phase, 0)(theta), 7);
    }
  });

  it("recovers V exactly when the background is given, and a lower V when it is ignored", () => {
    const points = scan(model(1000, 0.97, 10, 40), ANGLES, 2);
    const withB = fitFringe(points, { backgroundRate: 40 });
    expect(withB.visibility).toBeCloseTo(0.97, 10);
    expect(withB.backgroundRate).toBeCloseTo(40, 12);
    // Ignoring B folds it into the mean: V' = C₀V/(C₀ + B) (follows from the model).
    expect(fitFringe(points).visibility).toBeCloseTo((1000 * 0.97) / 1040, 10);
  });

  it("uses per-row background counts (e.g. accidentals) and per-row exposures", () => {
    const rate = model(800, 0.9, 30, 0);
    const points = ANGLES.map((a, i) => {
      const seconds = 1 + (i % 3);
      const backgroundCounts = 5 * seconds + i;
      return { angleDeg: a, counts: rate(a) * seconds + backgroundCounts, seconds, backgroundCounts };
    });
    const fit = fitFringe(points);
    expect(fit.visibility).toBeCloseTo(0.9, 10);
    expect(fit.phaseDeg).toBeCloseTo(30, 8);
  });

  it("quotes uncertainties that cover the truth at the expected rate over many Poisson-noisy scans", () => {
    const truth = { c0: 600, v: 0.95, phase: 12 };
    const rate = model(truth.c0, truth.v, truth.phase, 0);
    const draw = poissonSampler(7);
    const trials = 600;
    let coveredV = 0;
    let coveredPhase = 0;
    let pulls = 0;
    for (let i = 0; i < trials; i++) {
      const fit = fitFringe(ANGLES.map((a) => ({ angleDeg: a, counts: draw(rate(a)) })));
      if (Math.abs(fit.visibility - truth.v) <= fit.sigmaVisibility) coveredV++;
      if (Math.abs(fit.phaseDeg - truth.phase) <= fit.sigmaPhaseDeg) coveredPhase++;
      pulls += ((fit.visibility - truth.v) / fit.sigmaVisibility) ** 2;
    }
    // A 1σ interval covers 68.3 % (normal distribution; common practice, no source); with 600 trials the binomial spread is
    // ±1.9 %, so [0.62, 0.75] is a ±3.5σ band.
    expect(coveredV / trials).toBeGreaterThan(0.62);
    expect(coveredV / trials).toBeLessThan(0.75);
    expect(coveredPhase / trials).toBeGreaterThan(0.62);
    expect(coveredPhase / trials).toBeLessThan(0.75);
    // The mean squared pull is 1 for honest uncertainties; its spread over 600 trials is ±0.06.
    expect(pulls / trials).toBeGreaterThan(0.85);
    expect(pulls / trials).toBeLessThan(1.25);
  });

  it("one noisy scan lands within about its uncertainty of the truth", () => {
    const draw = poissonSampler(99);
    const fit = fitFringe(ANGLES.map((a) => ({ angleDeg: a, counts: draw(model(2000, 0.98, 0, 0)(a)) })));
    expect(Math.abs(fit.visibility - 0.98)).toBeLessThan(3 * fit.sigmaVisibility);
    expect(fit.sigmaVisibility).toBeGreaterThan(0);
    expect(fit.degreesOfFreedom).toBe(9);
  });

  // Follows from the model C(θ) = C₀[1 + V cos 2(θ − θ₀)] + B: a shift of B by δ moves V by −V δ/C₀.
  it("propagates the background's uncertainty: σ_V grows by V/C₀ · σ_B in quadrature", () => {
    const points = scan(model(1000, 0.9, 0, 20), ANGLES).map((p) => ({ ...p, counts: Math.round(p.counts) }));
    const a = fitFringe(points, { backgroundRate: 20 });
    const b = fitFringe(points, { backgroundRate: 20, backgroundRateSigma: 5 });
    expect(b.sigmaVisibility ** 2 - a.sigmaVisibility ** 2).toBeCloseTo(((a.visibility / a.c0) * 5) ** 2, 12);
  });

  it("refuses too few distinct angles and names a bad row", () => {
    expect(() => fitFringe([0, 180, 90, 270].map((a) => ({ angleDeg: a, counts: 10 })))).toThrow(/3 or more different analyser angles/);
    expect(() => fitFringe([{ angleDeg: 0, counts: 1 }, { angleDeg: 30, counts: Number.NaN }, { angleDeg: 60, counts: 1 }])).toThrow(/row 2: counts/);
  });
});

describe("visibility from raw extremes", () => {
  // First-order (delta-method) propagation of Poisson σ = √C: common practice, no source.
  it("is (C_max − C_min)/(C_max + C_min) with first-order Poisson σ", () => {
    const points = [{ angleDeg: 0, counts: 990 }, { angleDeg: 45, counts: 500 }, { angleDeg: 90, counts: 10 }];
    const v = visibilityFromExtremes(points);
    expect(v.visibility).toBeCloseTo(980 / 1000, 14);
    // ∂V/∂max = 2·min/(sum)², ∂V/∂min = −2·max/(sum)²
    expect(v.sigma).toBeCloseTo(Math.sqrt((20 / 1e6) ** 2 * 990 + (1980 / 1e6) ** 2 * 10), 14);
    expect([v.maxRow, v.minRow]).toEqual([0, 2]);
  });

  it("compares rates, not counts, when exposures differ", () => {
    const v = visibilityFromExtremes([{ angleDeg: 0, counts: 2000, seconds: 2 }, { angleDeg: 90, counts: 20 }]);
    expect(v.visibility).toBeCloseTo(980 / 1020, 14);
  });
});

describe("bases", () => {
  it("classifies the fixed arm's angle into H/V and D/A", () => {
    expect([0, 90, 180, -90, 0.3].map(fringeBasis)).toEqual(["HV", "HV", "HV", "HV", "HV"]);
    expect([45, 135, -45].map(fringeBasis)).toEqual(["DA", "DA", "DA"]);
    expect(fringeBasis(22.5)).toBe("other");
  });

  // Inverse-variance weighting of independent measurements: common practice, no source.
  it("collects visibilities per basis with inverse-variance weights", () => {
    const out = visibilitiesByBasis([
      { basis: "HV", visibility: 0.98, sigma: 0.01 },
      { basis: "HV", visibility: 0.96, sigma: 0.02 },
      { basis: "DA", visibility: 0.95, sigma: 0.005 },
    ]);
    expect(out[0].basis).toBe("HV");
    expect(out[0].visibility).toBeCloseTo((0.98 / 1e-4 + 0.96 / 4e-4) / (1 / 1e-4 + 1 / 4e-4), 14);
    expect(out[0].sigma).toBeCloseTo(Math.sqrt(1 / (1e4 + 2500)), 14);
    expect(out[1]).toEqual({ basis: "DA", scans: 1, visibility: 0.95, sigma: 0.005 });
  });
});
