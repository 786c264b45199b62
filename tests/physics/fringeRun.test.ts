import { describe, expect, it } from "vitest";
import { armAnglesForPolariser } from "@shared/physics/bell";
import { analyseFringeRun } from "@shared/physics/fringe";
import type { CountsRow } from "@shared/physics/types";

const DEG = Math.PI / 180;
/**
 * Pass probability of a Bell-diagonal state ρ = ¼(I + Σ t_i σ_i⊗σ_i) through linear polarisers:
 * ¼[1 + u(α)ᵀ T u(β)], u(θ) = (sin 2θ, 0, cos 2θ) (Horodecki et al., Phys. Lett. A 200, 340 (1995)).
 * Arm A at H gives V = |t_z|, at D gives V = |t_x|.
 */
const pass = (tx: number, tz: number) => (alpha: number, beta: number) =>
  0.25 * (1 + tx * Math.sin(2 * alpha * DEG) * Math.sin(2 * beta * DEG) + tz * Math.cos(2 * alpha * DEG) * Math.cos(2 * beta * DEG));

function scanRows(fixedDeg: number, p: (a: number, b: number) => number, pairs: number, extra: Partial<CountsRow> = {}): CountsRow[] {
  return Array.from({ length: 12 }, (_, i) => i * 15).map((theta) => ({
    setting: [armAnglesForPolariser(fixedDeg), armAnglesForPolariser(theta)],
    counts: pairs * p(fixedDeg, theta),
    seconds: 1,
    ...extra,
  }));
}

describe("a stored fringe-scan run", () => {
  it("fits one scan per setting of the fixed arm and collects V per basis", () => {
    const p = pass(-0.95, -0.98);
    const r = analyseFringeRun([...scanRows(0, p, 40_000), ...scanRows(45, p, 40_000)]);
    expect(r.scans.map((s) => [s.scannedArm, s.fixedAngleDeg, s.basis])).toEqual([["B", 0, "HV"], ["B", 45, "DA"]]);
    expect(r.scans[0].fit.visibility).toBeCloseTo(0.98, 10);
    expect(r.scans[1].fit.visibility).toBeCloseTo(0.95, 10);
    expect(r.scans[1].rows).toEqual(Array.from({ length: 12 }, (_, i) => 12 + i));
    expect(r.byBasis.map((b) => [b.basis, b.scans])).toEqual([["HV", 1], ["DA", 1]]);
    // A 15° grid hits the extremes at 0° and 90° exactly, so the raw visibility equals the fit here.
    expect(r.scans[0].extremes.visibility).toBeCloseTo(0.98, 10);
  });

  it("subtracts each row's accidentals s_a·s_b·τ/t when asked", () => {
    const p = pass(-0.9, -0.9);
    // Singles of 200 000 per second in each arm and a 3 ns window give 120 accidentals per second.
    const rows = scanRows(0, p, 20_000, { singlesA: 200_000, singlesB: 200_000 }).map((r) => ({ ...r, counts: r.counts + 120 }));
    expect(analyseFringeRun(rows).scans[0].fit.visibility).toBeCloseTo((0.9 * 5000) / 5120, 8);
    expect(analyseFringeRun(rows, { kind: "accidentals", windowNs: 3 }).scans[0].fit.visibility).toBeCloseTo(0.9, 8);
  });

  it("names the run's own row when a scan cannot be fitted", () => {
    const p = pass(-0.9, -0.9);
    const rows = [...scanRows(0, p, 1000), ...scanRows(45, p, 1000).slice(0, 2)];
    expect(() => analyseFringeRun(rows)).toThrow(/the scan with arm A at 45°: a fringe fit needs counts at 3 or more/);
    const bad = scanRows(0, p, 1000);
    bad[3] = { ...bad[3], setting: "HR" };
    expect(() => analyseFringeRun(bad)).toThrow(/row 4, arm B: R is circular/);
  });
});
