import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { bellDiagonalState, fringeScanSettings } from "@shared/physics/bell";
import { simulateCounts } from "@shared/physics";
import { FringeAnalysisSchema } from "@shared/schemas/fringe";
import { labWithRoles, type LabFixture } from "../support/clients";
import { startTestApp, type TestApp } from "../support/testApp";

/**
 * Bell-diagonal ρ with t = (−0.95, −0.95, −0.98): with arm A at H the fringe of arm B has
 * visibility |t_z| = 0.98, with arm A at D it has |t_x| = 0.95 (pass probability
 * ¼[1 + u(α)ᵀ T u(β)], Horodecki et al., Phys. Lett. A 200, 340 (1995)).
 */
const RHO = bellDiagonalState(-0.95, -0.95, -0.98);
const SCAN = Array.from({ length: 12 }, (_, i) => i * 15);
const SINGLES = { rateA: 150_000, rateB: 150_000, windowNs: 3 };

function fringeRows(noiseless: boolean, seed = 1) {
  const settings = [...fringeScanSettings(0, SCAN), ...fringeScanSettings(45, SCAN)];
  return simulateCounts({ rho: RHO, settings, pairRate: 40_000, seconds: 1, seed, noiseless, singles: SINGLES }).map((r) => ({
    ...r,
    counts: Math.round(r.counts),
    singlesA: Math.round(r.singlesA!),
    singlesB: Math.round(r.singlesB!),
  }));
}

describe("fringe-scan analysis", () => {
  let t: TestApp;
  let f: LabFixture;
  let lab: string;
  let sessionId: string;
  let runId: string;
  beforeAll(async () => {
    t = await startTestApp();
    f = await labWithRoles(t);
    lab = f.lab.id;
    const sourceId = (await f.clients.member.post(`/api/labs/${lab}/sources`, { name: "Loop source" }).expect(201)).body.id;
    sessionId = (await f.clients.member.post(`/api/labs/${lab}/sessions`, { sourceId, title: "Fringes", date: "2026-03-06", coincidenceWindowNs: SINGLES.windowNs }).expect(201)).body.id;
    runId = (await f.clients.member.post(`/api/labs/${lab}/sessions/${sessionId}/runs`, { kind: "fringe", settingSetId: "custom", name: "Arm A at H, then D", rows: fringeRows(true) }).expect(201)).body.id;
  });
  afterAll(() => t.close());

  const path = (id: string, search = "") => `/api/labs/${lab}/runs/${id}/fringe-fit${search}`;

  it("fits one fringe per setting of arm A and collects the visibilities per basis", async () => {
    const a = FringeAnalysisSchema.parse((await f.clients.viewer.get(path(runId, "?background=accidentals")).expect(200)).body);
    expect(a.background).toEqual({ kind: "accidentals", windowNs: 3, rate: null, sigma: 0 });
    expect(a.scans.map((s) => [s.scannedArm, s.fixedAngleDeg, s.basis, s.rows.length])).toEqual([["B", 0, "HV", 12], ["B", 45, "DA", 12]]);
    // Accidentals s_a·s_b·τ = 67.5 per second are subtracted, so V is the state's (rounding aside).
    expect(a.scans[0].fit.visibility).toBeCloseTo(0.98, 3);
    expect(a.scans[1].fit.visibility).toBeCloseTo(0.95, 3);
    expect(a.scans[0].fit.backgroundRate).toBeCloseTo(67.5, 6);
    expect(a.byBasis.map((b) => b.basis)).toEqual(["HV", "DA"]);
    expect(a.byBasis[0].visibility).toBeCloseTo(a.scans[0].fit.visibility, 12);
    expect(a.scans[0].fit.sigmaVisibility).toBeGreaterThan(0);
  });

  it("without background the accidentals lower the visibility: V′ = C₀V/(C₀ + B) (follows from the model)", async () => {
    const a = FringeAnalysisSchema.parse((await f.clients.viewer.get(path(runId)).expect(200)).body);
    const c0 = 40_000 / 4;
    expect(a.scans[0].fit.visibility).toBeCloseTo((c0 * 0.98) / (c0 + 67.5), 3);
    expect(a.scans[0].extremes.visibility).toBeLessThan(0.98);
    const withRate = FringeAnalysisSchema.parse((await f.clients.viewer.get(path(runId, "?background=rate&backgroundRate=67.5&backgroundSigma=2")).expect(200)).body);
    expect(withRate.scans[0].fit.visibility).toBeCloseTo(0.98, 3);
    expect(withRate.scans[0].points[0].backgroundCounts).toBeCloseTo(67.5, 9);
  });

  it("gets noisy data right within the quoted uncertainty", async () => {
    const noisy = (await f.clients.member.post(`/api/labs/${lab}/sessions/${sessionId}/runs`, { kind: "fringe", settingSetId: "custom", name: "Noisy", rows: fringeRows(false, 42) }).expect(201)).body.id;
    const a = FringeAnalysisSchema.parse((await f.clients.viewer.get(path(noisy, "?background=accidentals")).expect(200)).body);
    for (const [scan, v] of [[0, 0.98], [1, 0.95]] as const) expect(Math.abs(a.scans[scan].fit.visibility - v)).toBeLessThan(4 * a.scans[scan].fit.sigmaVisibility);
  });

  it("names the missing parameter or field", async () => {
    const noRate = await f.clients.viewer.get(path(runId, "?background=rate")).expect(400);
    expect(noRate.body.error.details).toEqual([{ field: "backgroundRate", message: "Give the background rate (counts per second) for background=rate." }]);
    await f.clients.viewer.get(path(runId, "?background=sideways")).expect(400);
    const sourceId = (await f.clients.member.post(`/api/labs/${lab}/sources`, { name: "No window" }).expect(201)).body.id;
    const bare = (await f.clients.member.post(`/api/labs/${lab}/sessions`, { sourceId, title: "No window", date: "2026-03-07" }).expect(201)).body.id;
    const other = (await f.clients.member.post(`/api/labs/${lab}/sessions/${bare}/runs`, { kind: "fringe", settingSetId: "custom", name: "Elsewhere", rows: fringeRows(true) }).expect(201)).body.id;
    const noWindow = await f.clients.viewer.get(path(other, "?background=accidentals")).expect(400);
    expect(noWindow.body.error.details[0].field).toBe("windowNs");
    await f.clients.viewer.get(path(other, "?background=accidentals&windowNs=3")).expect(200);
  });

  it("is for fringe runs of this lab only", async () => {
    const bellId = (await f.clients.member.post(`/api/labs/${lab}/sessions/${sessionId}/runs`, { kind: "bell", settingSetId: "custom", name: "Not a fringe", rows: fringeRows(true) }).expect(201)).body.id;
    const wrong = await f.clients.viewer.get(path(bellId)).expect(400);
    expect(wrong.body.error.details[0]).toEqual({ field: "runId", message: "This is a bell run; this analysis is for fringe runs." });
    await f.clients.outsider.get(path(runId)).expect(404);
  });
});
