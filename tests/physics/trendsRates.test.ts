import { describe, expect, it } from "vitest";
import { accidentalRate, armAnglesForPolariser, pairRate } from "@shared/physics/bell";
import type { CountsRow } from "@shared/physics/types";

describe("pair rate for trend plots (our definition: coincidences per second in one complete basis)", () => {
  it("sums HH, HV, VH, VV of a tomography run and ignores incomplete bases", () => {
    const rows: CountsRow[] = [
      { setting: "HH", counts: 10 },
      { setting: "HV", counts: 1000, seconds: 2 },
      { setting: "VV", counts: 12 },
      { setting: "VH", counts: 480 },
      { setting: "DD", counts: 300 },
      { setting: "RH", counts: 250 },
    ];
    const r = pairRate(rows)!;
    expect(r.value).toBeCloseTo(10 + 500 + 12 + 480, 12);
    expect(r.sigma).toBeCloseTo(Math.sqrt(10 + 1000 / 4 + 12 + 480), 12);
  });

  it("averages over the four bases of a Bell test given as waveplate angles", () => {
    const rows: CountsRow[] = [];
    for (const [a, b, total] of [[0, 22.5, 1000], [0, 67.5, 1100], [45, 22.5, 1200], [45, 67.5, 1300]]) {
      for (const [x, y] of [[a, b], [a + 90, b + 90], [a, b + 90], [a + 90, b]]) {
        rows.push({ setting: [armAnglesForPolariser(x), armAnglesForPolariser(y)], counts: total / 4 });
      }
    }
    expect(pairRate(rows)!.value).toBeCloseTo(1150, 9);
  });

  it("is null without a complete basis", () => {
    expect(pairRate([{ setting: "HH", counts: 5 }, { setting: "HV", counts: 5 }])).toBeNull();
  });
});

describe("accidental rate", () => {
  it("is Σ s_a·s_b·τ/t ÷ Σ t (physics contract §3)", () => {
    const rows: CountsRow[] = [
      { setting: "HH", counts: 1, seconds: 1, singlesA: 100_000, singlesB: 200_000 },
      { setting: "HV", counts: 1, seconds: 2, singlesA: 200_000, singlesB: 400_000 },
    ];
    const tau = 3e-9;
    const expected = (100_000 * 200_000 * tau + (200_000 * 400_000 * tau) / 2) / 3;
    expect(accidentalRate(rows, 3)).toBeCloseTo(expected, 12);
    expect(accidentalRate(rows, null)).toBeNull();
    expect(accidentalRate([{ setting: "HH", counts: 1 }], 3)).toBeNull();
  });
});
