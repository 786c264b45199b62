import { describe, expect, it } from "vitest";
import { anglesForLetter } from "@shared/physics/analyserAngles";
import { armAnglesForPolariser, polariserAngleOfArm, rowPolariserAngles } from "@shared/physics/bell";

describe("polariser angle of a stored setting", () => {
  it("QWP at θ and HWP at θ/2 analyse linear polarisation at θ (a QWP along the polarisation leaves it unchanged; an HWP at h rotates H to 2h — Hecht, Optics, §8.7)", () => {
    for (const theta of [0, 10, 22.5, 45, 67.5, 90, 112.5, 135, 157.5, 170]) {
      expect(polariserAngleOfArm(armAnglesForPolariser(theta))).toBeCloseTo(theta, 9);
      // The reflected PBS port analyses the orthogonal state, θ + 90° (physics contract §2).
      expect(polariserAngleOfArm({ ...armAnglesForPolariser(theta), port: "reflected" })).toBeCloseTo((theta + 90) % 180, 9);
    }
  });

  it("agrees with the engine's setting sheet: the angles it gives for H, V, D, A analyse 0°, 90°, 45°, 135° (physics contract §1–§2)", () => {
    const expected = { H: 0, V: 90, D: 45, A: 135 } as const;
    for (const [letter, deg] of Object.entries(expected)) {
      const { qwpDeg, hwpDeg } = anglesForLetter(letter as keyof typeof expected, "R=H+iV");
      expect(polariserAngleOfArm({ qwpDeg, hwpDeg })).toBeCloseTo(deg, 6);
    }
  });

  it("refuses an elliptical analyser and says how to set a linear one", () => {
    // QWP at 0° after an HWP at 22.5° turns D into circular polarisation (follows from §2).
    expect(() => polariserAngleOfArm({ qwpDeg: 0, hwpDeg: 22.5 })).toThrow(/elliptical.*QWP at θ and the HWP at θ\/2/);
  });

  it("reads labels and names the row and arm of a bad one", () => {
    expect(rowPolariserAngles("HD", 0)).toEqual([0, 45]);
    expect(rowPolariserAngles("VA", 0)).toEqual([90, 135]);
    expect(() => rowPolariserAngles("HR", 4)).toThrow(/row 5, arm B: R is circular/);
    expect(() => rowPolariserAngles([armAnglesForPolariser(0), { qwpDeg: 0, hwpDeg: 22.5 }], 2)).toThrow(/row 3, arm B: QWP 0°/);
    expect(() => rowPolariserAngles("HVH", 0)).toThrow(/row 1: "HVH" is not a two-photon setting/);
  });
});
