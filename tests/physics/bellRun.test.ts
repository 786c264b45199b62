import { describe, expect, it } from "vitest";
import { STANDARD_BELL_ANGLES, analyseBellRun, armAnglesForPolariser, bellDiagonalState, bellTestSettings, fringeScanSettings, predictedChsh, settingPairs } from "@shared/physics/bell";
import type { CountsRow } from "@shared/physics/types";

/** Noiseless rows for φ⁺, whose pass probability at (α, β) is ½cos²(α − β) (follows from the definition). */
function phiPlusRun(angles = STANDARD_BELL_ANGLES, pairs = 10_000): CountsRow[] {
  return settingPairs(angles).flatMap(({ alphaDeg: a, betaDeg: b }) =>
    [[a, b], [a + 90, b + 90], [a, b + 90], [a + 90, b]].map(([x, y]) => ({
      setting: [armAnglesForPolariser(x), armAnglesForPolariser(y)],
      counts: pairs * 0.5 * Math.cos(((x - y) * Math.PI) / 180) ** 2,
      seconds: 1,
    })),
  );
}

describe("a stored Bell-test run", () => {
  it("uses the standard angles when the rows hold them, and gives 2√2 for φ⁺ (Clauser et al. 1969; Tsirelson 1980)", () => {
    const r = analyseBellRun(phiPlusRun());
    expect(r.anglesOrigin).toBe("standard");
    expect(r.s).toBeCloseTo(2 * Math.SQRT2, 10);
  });

  it("reads a, a′, b, b′ off the rows when they are not the standard ones", () => {
    const angles = { aDeg: 10, aPrimeDeg: 55, bDeg: 32.5, bPrimeDeg: 77.5 };
    const r = analyseBellRun(phiPlusRun(angles));
    expect(r.anglesOrigin).toBe("fromRows");
    expect(r.angles).toEqual(angles);
    expect(r.s).toBeCloseTo(2 * Math.SQRT2, 10);
  });

  it("honours angles given by the caller (swapping b and b′ changes S)", () => {
    const r = analyseBellRun(phiPlusRun(), { ...STANDARD_BELL_ANGLES, bDeg: 67.5, bPrimeDeg: 22.5 });
    expect(r.anglesOrigin).toBe("given");
    // E(a,b′) − E(a,b) + E(a′,b′) + E(a′,b) with E = cos 2(α − β): 1/√2·(−1 − 1 + 1 + 1)·… = 0
    expect(r.s).toBeCloseTo(0, 10);
  });

  it("says when an arm has more than two settings", () => {
    const rows = phiPlusRun({ aDeg: 10, aPrimeDeg: 55, bDeg: 32.5, bPrimeDeg: 77.5 });
    rows[0] = { ...rows[0], setting: [armAnglesForPolariser(20), armAnglesForPolariser(32.5)] };
    expect(() => analyseBellRun(rows)).toThrow(/arm A was set to 3 different analyser settings/);
  });

  it("names the missing row when the standard angles are incomplete", () => {
    expect(() => analyseBellRun(phiPlusRun().slice(1))).toThrow(/no row was measured at A 0°, B 22\.5°/);
  });
});

describe("Bell-diagonal states and the measured layouts", () => {
  it("ψ⁻ is t = (−1, −1, −1); S at the standard angles is √2(t_x + t_z), the maximum 2√(t_z² + t_x²) for |t_x| = |t_y| (Horodecki et al., Phys. Lett. A 200, 340 (1995))", () => {
    const psiMinus = bellDiagonalState(-1, -1, -1);
    expect(psiMinus.re[1][1]).toBeCloseTo(0.5, 14);
    expect(psiMinus.re[1][2]).toBeCloseTo(-0.5, 14);
    expect(psiMinus.re[0][0]).toBeCloseTo(0, 14);
    const rho = bellDiagonalState(-0.95, -0.95, -0.98);
    const p = predictedChsh(rho, STANDARD_BELL_ANGLES);
    expect(p.s).toBeCloseTo(Math.SQRT2 * (-0.95 - 0.98), 12);
    expect(p.maximum).toBeCloseTo(2 * Math.hypot(0.95, 0.98), 12);
    expect(() => bellDiagonalState(1, 1, 1)).toThrow(/not a physical/);
  });

  it("the sixteen Bell-test settings are what the CHSH analysis looks for", () => {
    const settings = bellTestSettings(STANDARD_BELL_ANGLES);
    expect(settings).toHaveLength(16);
    const rows = settings.map((setting) => ({ setting, counts: 100 }));
    const r = analyseBellRun(rows);
    expect(r.correlations.map((c) => c.rows)).toEqual([[0, 1, 2, 3], [4, 5, 6, 7], [8, 9, 10, 11], [12, 13, 14, 15]]);
    expect(fringeScanSettings(45, [0, 90])).toEqual([[{ qwpDeg: 45, hwpDeg: 22.5 }, { qwpDeg: 0, hwpDeg: 0 }], [{ qwpDeg: 45, hwpDeg: 22.5 }, { qwpDeg: 90, hwpDeg: 45 }]]);
  });
});
