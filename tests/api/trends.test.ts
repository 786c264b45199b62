import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { STANDARD_BELL_ANGLES, bellDiagonalState, bellTestSettings, fringeScanSettings } from "@shared/physics/bell";
import { simulateCounts, standardSet } from "@shared/physics";
import { TrendSchema } from "@shared/schemas/trends";
import { labWithRoles, type LabFixture } from "../support/clients";
import { startTestApp, type TestApp } from "../support/testApp";

const RHO = bellDiagonalState(-0.95, -0.95, -0.98);
const WINDOW_NS = 3;

/** Tomography rows with singles (accidentals rate r_a·r_b·τ rises with the square of the pump power). */
function tomographyRows(powerMw: number, seed: number) {
  const rate = 30_000 * powerMw;
  return simulateCounts({ rho: RHO, settings: standardSet("tomo16").labels, pairRate: 2000 * powerMw, seconds: 1, seed, singles: { rateA: rate, rateB: rate, windowNs: WINDOW_NS } });
}

describe("trends", () => {
  let t: TestApp;
  let f: LabFixture;
  let lab: string;
  let sourceId: string;
  let sessionId: string;
  const post = (body: object) => f.clients.member.post(`/api/labs/${lab}/sessions/${sessionId}/runs`, body).expect(201);
  beforeAll(async () => {
    t = await startTestApp();
    f = await labWithRoles(t);
    lab = f.lab.id;
    sourceId = (await f.clients.member.post(`/api/labs/${lab}/sources`, { name: "Loop source", targetState: "psi-" }).expect(201)).body.id;
    sessionId = (await f.clients.member.post(`/api/labs/${lab}/sessions`, { sourceId, title: "Power sweep", date: "2026-03-02", coincidenceWindowNs: WINDOW_NS, crystalTemperatureC: 31 }).expect(201)).body.id;
    for (const [i, power] of [1, 5, 20].entries()) {
      await post({ kind: "tomography", settingSetId: "tomo16", name: `${power} mW`, conditions: { pumpPowerMw: power }, rows: tomographyRows(power, 100 + i), reconstruction: { monteCarloSamples: 20 } });
    }
    const bell = simulateCounts({ rho: RHO, settings: bellTestSettings(STANDARD_BELL_ANGLES), pairRate: 40_000, seed: 7 });
    await post({ kind: "bell", settingSetId: "custom", name: "CHSH", rows: bell });
    const fringe = simulateCounts({ rho: RHO, settings: [...fringeScanSettings(0, [0, 30, 60, 90, 120, 150]), ...fringeScanSettings(45, [0, 30, 60, 90, 120, 150])], pairRate: 40_000, seed: 8 });
    await post({ kind: "fringe", settingSetId: "custom", name: "Fringes", rows: fringe });
  });
  afterAll(() => t.close());

  it("lists every run of a session with its figures, parameters, pair rate and accidentals", async () => {
    const trend = TrendSchema.parse((await f.clients.viewer.get(`/api/labs/${lab}/trends?sessionId=${sessionId}`).expect(200)).body);
    expect(trend.scope).toMatchObject({ kind: "session", id: sessionId, title: "Power sweep", targetState: "psi-" });
    expect(trend.runs.map((r) => [r.name, r.kind, r.x.pumpPowerMw, r.x.order])).toEqual([
      ["1 mW", "tomography", 1, 1],
      ["5 mW", "tomography", 5, 2],
      ["20 mW", "tomography", 20, 3],
      ["CHSH", "bell", null, 4],
      ["Fringes", "fringe", null, 5],
    ]);
    const [p1, , p20, bell, fringe] = trend.runs;
    // The session's temperature applies to runs that do not record their own.
    expect(p1.x.crystalTemperatureC).toBe(31);
    expect(p1.x.exposureSeconds).toBe(1);
    // Fidelity to ψ⁻ of the Bell-diagonal state is ¼(1 − t_x − t_y − t_z) = 0.97 (Horodecki & Horodecki,
    // PRA 54, 1838 (1996)); at 1 mW the accidentals hardly matter, at 20 mW they lower it visibly.
    expect(Math.abs(p1.figures.fidelityTarget!.value - 0.97)).toBeLessThan(0.03);
    expect(p20.figures.fidelityTarget!.value).toBeLessThan(p1.figures.fidelityTarget!.value - 0.03);
    expect(p20.figures.fidelityTarget!.sigma).toBeGreaterThan(0);
    expect(p20.figures.fidelityTarget).toEqual(p20.figures.fidelityPsiMinus);
    // Pair rate: HH + HV + VH + VV per second; accidentals r_a·r_b·τ = (30 000·P)²·3 ns, plus the
    // Poisson spread of the simulated singles (tiny at these rates).
    const hvBasis = tomographyRows(20, 102).filter((r) => ["HH", "HV", "VH", "VV"].includes(r.setting as string)).reduce((s, r) => s + r.counts, 0);
    expect(p20.pairRate!.value).toBe(hvBasis);
    expect(p20.pairRate!.sigma).toBeCloseTo(Math.sqrt(hvBasis), 9);
    expect(p20.accidentalRate!).toBeCloseTo((600_000 ** 2) * 3e-9, -1);
    expect(p1.accidentalRate!).toBeCloseTo((30_000 ** 2) * 3e-9, 0);
    // Measured figures of Bell and fringe runs: |S| ≈ √2(0.95 + 0.98), V ≈ 0.98 and 0.95.
    expect(Math.abs(bell.figures.chshAbsS!.value - Math.SQRT2 * 1.93)).toBeLessThan(4 * bell.figures.chshAbsS!.sigma!);
    expect(bell.figures.fidelityTarget).toBeNull();
    expect(bell.reconstructionId).toBeNull();
    expect(Math.abs(fringe.figures.visibilityHV!.value - 0.98)).toBeLessThan(4 * fringe.figures.visibilityHV!.sigma!);
    expect(Math.abs(fringe.figures.visibilityDA!.value - 0.95)).toBeLessThan(4 * fringe.figures.visibilityDA!.sigma!);
    expect(fringe.pairRate).toBeNull();
  });

  it("prefers the reconstruction with accidentals subtracted when asked, and says when there is none", async () => {
    const trend = TrendSchema.parse((await f.clients.viewer.get(`/api/labs/${lab}/trends?sessionId=${sessionId}&accidentals=true`).expect(200)).body);
    expect(trend.accidentals).toBe(true);
    expect(trend.runs[0].notes).toEqual(["Only a reconstruction without accidental subtraction exists; it is shown."]);
    const runId = trend.runs[2].runId;
    await f.clients.member.post(`/api/labs/${lab}/runs/${runId}/reconstructions`, { method: "mle", corrections: { accidentals: true }, monteCarloSamples: 0 }).expect(201);
    const again = TrendSchema.parse((await f.clients.viewer.get(`/api/labs/${lab}/trends?sessionId=${sessionId}&accidentals=true`).expect(200)).body);
    const subtracted = again.runs[2];
    expect(subtracted.notes).toEqual([]);
    expect(subtracted.reconstructionId).not.toBe(trend.runs[2].reconstructionId);
    // At 20 mW the accidentals are ~10 % of the coincidences: subtracting them restores the state's 0.97.
    expect(subtracted.figures.fidelityTarget!.value).toBeGreaterThan(trend.runs[2].figures.fidelityTarget!.value);
    expect(Math.abs(subtracted.figures.fidelityTarget!.value - 0.97)).toBeLessThan(0.01);
  });

  it("spans a source's sessions or the whole lab, and checks its scope", async () => {
    const bySource = TrendSchema.parse((await f.clients.viewer.get(`/api/labs/${lab}/trends?sourceId=${sourceId}`).expect(200)).body);
    expect(bySource.scope).toMatchObject({ kind: "source", title: "Loop source" });
    expect(bySource.runs).toHaveLength(5);
    const byLab = TrendSchema.parse((await f.clients.viewer.get(`/api/labs/${lab}/trends`).expect(200)).body);
    expect(byLab.scope).toMatchObject({ kind: "lab", id: lab, targetState: null });
    expect(byLab.runs[2].figures.fidelityTarget).toEqual(bySource.runs[2].figures.fidelityTarget);
    const both = await f.clients.viewer.get(`/api/labs/${lab}/trends?sessionId=${sessionId}&sourceId=${sourceId}`).expect(400);
    expect(both.body.error.details[0].field).toBe("sourceId");
    await f.clients.viewer.get(`/api/labs/${lab}/trends?method=guess`).expect(400);
    const theirs = (await f.clients.outsider.get("/api/labs").expect(200)).body.data[0].id;
    await f.clients.outsider.get(`/api/labs/${theirs}/trends?sessionId=${sessionId}`).expect(404);
    await f.clients.outsider.get(`/api/labs/${lab}/trends`).expect(404);
  });
});
