/**
 * The analyser model of physics.md §2 and the standard sets of §1.
 */
import { describe, expect, it } from "vitest";
import { analyserState, anglesForLetter, letterState, settingSheet, standardSet, LETTERS, ORTHOGONAL } from "@shared/physics";
import { overlap2 } from "@shared/physics/waveplates";
import type { ArmCalibration, Handedness } from "@shared/physics";

const HANDS: Handedness[] = ["R=H+iV", "R=H-iV"];

describe("states (physics.md §1)", () => {
  it("|R⟩ = (|H⟩ + i|V⟩)/√2 by default; the other handedness swaps R and L", () => {
    const r = letterState("R");
    expect([r.re[0], r.im[0], r.re[1], r.im[1]].map((x) => x * Math.SQRT2)).toEqual([1, 0, 0, 1].map((x) => expect.closeTo(x, 15)));
    expect(overlap2(letterState("R", "R=H-iV"), letterState("L", "R=H+iV"))).toBeCloseTo(1, 15);
  });
  it("each letter is orthogonal to its PBS partner and unbiased to the other bases", () => {
    for (const a of LETTERS) {
      for (const b of LETTERS) {
        const o = overlap2(letterState(a), letterState(b));
        expect(o).toBeCloseTo(a === b ? 1 : ORTHOGONAL[a] === b ? 0 : 0.5, 15);
      }
    }
  });
});

describe("waveplate model |a⟩ = (W(h, π)·W(q, π/2))†|H⟩ (physics.md §2; Jones calculus, Hecht, Optics §8.12)", () => {
  it("QWP 0° + HWP 22.5° analyses L (the QWP turns L into D, the HWP D into H); HWP 45° analyses V; QWP 45° keeps D", () => {
    expect(overlap2(analyserState({ qwpDeg: 0, hwpDeg: 22.5 }), letterState("L"))).toBeCloseTo(1, 14);
    expect(overlap2(analyserState({ qwpDeg: 0, hwpDeg: 45 }), letterState("V"))).toBeCloseTo(1, 14);
    expect(overlap2(analyserState({ qwpDeg: 45, hwpDeg: 22.5 }), letterState("D"))).toBeCloseTo(1, 14);
  });
  it("the reflected port analyses the orthogonal state, for any angles and calibrations", () => {
    const cal: ArmCalibration = { qwp: { fastAxisOffsetDeg: 1.7, retardanceErrorDeg: -4 }, hwp: { fastAxisOffsetDeg: -0.9, retardanceErrorDeg: 3 } };
    for (const [q, h] of [[0, 0], [12, 33], [45, 22.5], [-70, 10]]) {
      const t = analyserState({ qwpDeg: q, hwpDeg: h }, cal);
      const r = analyserState({ qwpDeg: q, hwpDeg: h, port: "reflected" }, cal);
      expect(overlap2(t, r)).toBeCloseTo(0, 14);
    }
  });
  it("a fast-axis offset is the same as turning the plate: offset δ at angle θ − δ equals an ideal plate at θ", () => {
    const cal: ArmCalibration = { qwp: { fastAxisOffsetDeg: 2 }, hwp: { fastAxisOffsetDeg: -3 } };
    expect(overlap2(analyserState({ qwpDeg: 28, hwpDeg: 13 }, cal), analyserState({ qwpDeg: 30, hwpDeg: 10 }))).toBeCloseTo(1, 14);
  });
});

describe("setting sheet: angles from the inverse of the model", () => {
  for (const hand of HANDS) {
    it(`ideal plates (${hand}): every letter is reached exactly`, () => {
      for (const l of LETTERS) {
        const a = anglesForLetter(l, hand);
        expect(a.fidelity).toBeCloseTo(1, 12);
        expect(overlap2(analyserState(a), letterState(l, hand))).toBeCloseTo(1, 12);
      }
    });
  }
  // The angles every lab turns to (common practice, no source); they follow from the waveplate
  // model of physics.md §2; the neighbouring tests check the analysed states themselves.
  it("ideal plates give the familiar angles (H 0/0, V 0/45, D 45/22.5, A 45/−22.5, R 0/−22.5, L 0/22.5)", () => {
    const table = Object.fromEntries(LETTERS.map((l) => [l, anglesForLetter(l, "R=H+iV")]));
    expect([table.H.qwpDeg, table.H.hwpDeg]).toEqual([0, 0]);
    expect([table.V.qwpDeg, table.V.hwpDeg]).toEqual([0, 45]);
    expect([table.D.qwpDeg, table.D.hwpDeg]).toEqual([45, 22.5]);
    expect([table.A.qwpDeg, table.A.hwpDeg]).toEqual([45, -22.5]);
    expect([table.R.qwpDeg, table.R.hwpDeg]).toEqual([0, -22.5]);
    expect([table.L.qwpDeg, table.L.hwpDeg]).toEqual([0, 22.5]);
  });
  it("with fast-axis offsets the sheet compensates them exactly", () => {
    const cal: ArmCalibration = { qwp: { fastAxisOffsetDeg: 1.3 }, hwp: { fastAxisOffsetDeg: -0.7 } };
    for (const l of LETTERS) {
      const a = anglesForLetter(l, "R=H+iV", cal);
      expect(a.fidelity).toBeGreaterThan(1 - 1e-12);
      expect(overlap2(analyserState(a, cal), letterState(l))).toBeGreaterThan(1 - 1e-12);
    }
  });
  it("with retardance errors it returns the best reachable angles and says how close they come", () => {
    const cal: ArmCalibration = { qwp: { retardanceErrorDeg: 6 }, hwp: { retardanceErrorDeg: -5 } };
    for (const l of LETTERS) {
      const a = anglesForLetter(l, "R=H+iV", cal);
      expect(overlap2(analyserState(a, cal), letterState(l))).toBeCloseTo(a.fidelity, 12);
      expect(a.fidelity).toBeGreaterThan(0.99);
    }
  });
  it("a sheet lists one entry per setting: 16 for tomo16, 9 (four outcomes each) for pairs9", () => {
    const s16 = settingSheet("tomo16");
    expect(s16.settings.map((s) => s.name)).toEqual(standardSet("tomo16").labels);
    expect(s16.settings[0].arms).toHaveLength(2);
    const s9 = settingSheet("pairs9");
    expect(s9.settings).toHaveLength(9);
    expect(s9.settings[1]).toMatchObject({ name: "ZX", outcomes: ["HD", "HA", "VD", "VA"] });
  });
});

describe("standard sets (physics.md §1)", () => {
  it("tomo16 is the James, Kwiat, Munro, White PRA 64, 052312 (2001) list, in their order", () => {
    expect(standardSet("tomo16").labels.join(" ")).toBe("HH HV VV VH RH RV DV DH DR DD RD HD VD VL HL RL");
  });
  it("tomo36 has all 36 pairs of the six letters once; pairs9 the same 36 projectors in 9 groups of 4", () => {
    const t36 = standardSet("tomo36").labels;
    expect(new Set(t36).size).toBe(36);
    const p9 = standardSet("pairs9");
    expect(p9.groups).toHaveLength(9);
    expect(new Set(p9.labels)).toEqual(new Set(t36));
    expect(p9.bothPorts).toBe(true);
  });
  it("single qubits and more photons: 4/6 for one photon, 4ⁿ, 6ⁿ and 3ⁿ·2ⁿ for n = 3, 4", () => {
    expect(standardSet("qubit4").labels).toEqual(["H", "V", "D", "R"]);
    expect(standardSet("qubit6").labels).toHaveLength(6);
    for (const n of [3, 4]) {
      expect(standardSet("product4", n).labels).toHaveLength(4 ** n);
      expect(standardSet("product6", n).labels).toHaveLength(6 ** n);
      expect(standardSet("bases3", n).labels).toHaveLength(6 ** n);
      expect(standardSet("bases3", n).groups).toHaveLength(3 ** n);
    }
    expect(() => standardSet("tomo16", 3)).toThrow(/2 photon/);
    expect(() => standardSet("product4", 5)).toThrow(/1 … 4/);
  });
});
