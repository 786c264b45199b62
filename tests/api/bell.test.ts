import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { STANDARD_BELL_ANGLES, bellDiagonalState, bellTestSettings } from "@shared/physics/bell";
import { simulateCounts, standardSet } from "@shared/physics";
import { BellTestSchema } from "@shared/schemas/bell";
import { labWithRoles, type LabFixture } from "../support/clients";
import { startTestApp, type TestApp } from "../support/testApp";

/**
 * The demo-like state: Bell-diagonal with t = (−0.95, −0.95, −0.98). At the standard angles it
 * predicts E(α, β) = t_x sin 2α sin 2β + t_z cos 2α cos 2β and S = √2(t_x + t_z), its maximum is
 * 2√(t_z² + t_x²) (Horodecki et al., Phys. Lett. A 200, 340 (1995)).
 */
const T = { x: -0.95, z: -0.98 };
const RHO = bellDiagonalState(T.x, T.x, T.z);
const S_EXPECTED = Math.SQRT2 * (T.x + T.z);
const MAX_EXPECTED = 2 * Math.hypot(T.x, T.z);
const PAIRS = 40_000;

const bellRows = (seed: number | null) =>
  simulateCounts({ rho: RHO, settings: bellTestSettings(STANDARD_BELL_ANGLES), pairRate: PAIRS, seed: seed ?? 1, noiseless: seed === null }).map((r) => ({ ...r, counts: Math.round(r.counts), seconds: 1 }));

describe("Bell-test analysis", () => {
  let t: TestApp;
  let f: LabFixture;
  let lab: string;
  let sessionId: string;
  let bellRunId: string;
  let tomographyRunId: string;
  beforeAll(async () => {
    t = await startTestApp();
    f = await labWithRoles(t);
    lab = f.lab.id;
    const sourceId = (await f.clients.member.post(`/api/labs/${lab}/sources`, { name: "Loop source", targetState: "psi-" }).expect(201)).body.id;
    sessionId = (await f.clients.member.post(`/api/labs/${lab}/sessions`, { sourceId, title: "Bell test", date: "2026-03-04", coincidenceWindowNs: 3 }).expect(201)).body.id;
    const tomoRows = simulateCounts({ rho: RHO, settings: standardSet("tomo16").labels, pairRate: PAIRS, seed: 11 }).map((r) => ({ setting: r.setting, counts: r.counts }));
    tomographyRunId = (await f.clients.member.post(`/api/labs/${lab}/sessions/${sessionId}/runs`, { kind: "tomography", settingSetId: "tomo16", name: "Tomography", rows: tomoRows, reconstruction: { monteCarloSamples: 20 } }).expect(201)).body.id;
    bellRunId = (await f.clients.member.post(`/api/labs/${lab}/sessions/${sessionId}/runs`, { kind: "bell", settingSetId: "custom", name: "CHSH", rows: bellRows(null) }).expect(201)).body.id;
  });
  afterAll(() => t.close());

  const path = (runId: string, search = "") => `/api/labs/${lab}/runs/${runId}/bell-test${search}`;

  it("gives each E ± σ, S ± σ_S and the significance at the standard angles (CHSH, PRL 23, 880 (1969))", async () => {
    const res = await f.clients.viewer.get(path(bellRunId)).expect(200);
    const b = BellTestSchema.parse(res.body);
    expect(b.anglesOrigin).toBe("standard");
    expect(b.angles).toEqual(STANDARD_BELL_ANGLES);
    // Rounding 40 000 pairs to whole counts moves S by well under 1e-3.
    expect(b.s).toBeCloseTo(S_EXPECTED, 3);
    // σ_E² = (1 − E²)/N per pair (first-order Poisson propagation, equal exposures), summed for S.
    const sigmaS = Math.sqrt(b.correlations.reduce((s, c) => s + (1 - c.value ** 2) / c.totalCounts, 0));
    expect(b.sigmaS).toBeCloseTo(sigmaS, 10);
    expect(b.significance).toBeCloseTo((Math.abs(b.s) - 2) / b.sigmaS, 10);
    expect(b.correlations.map((c) => c.rows)).toEqual([[0, 1, 2, 3], [4, 5, 6, 7], [8, 9, 10, 11], [12, 13, 14, 15]]);
  });

  it("sets beside them what the session's reconstructed ρ predicts at the same angles and at best", async () => {
    const b = BellTestSchema.parse((await f.clients.viewer.get(path(bellRunId)).expect(200)).body);
    expect(b.prediction).not.toBeNull();
    expect(b.prediction!.runId).toBe(tomographyRunId);
    expect(b.prediction!.method).toBe("mle");
    // ρ is estimated from 16 × ~10 000 Poisson counts: its S is within a few 0.01 of the true state's.
    expect(Math.abs(b.prediction!.s - S_EXPECTED)).toBeLessThan(0.03);
    expect(Math.abs(b.prediction!.maximum - MAX_EXPECTED)).toBeLessThan(0.03);
    expect(b.prediction!.maximumSigma).toBeGreaterThan(0);
    b.correlations.forEach((c) => expect(Math.abs(c.predicted! - c.value)).toBeLessThan(0.02));
    expect(b.predictionNote).toBeNull();
  });

  it("recomputes at angles the caller gives, and asks for all four", async () => {
    const swapped = BellTestSchema.parse((await f.clients.viewer.get(path(bellRunId, "?aDeg=0&aPrimeDeg=45&bDeg=67.5&bPrimeDeg=22.5")).expect(200)).body);
    expect(swapped.anglesOrigin).toBe("given");
    // With b = 67.5°, b′ = 22.5°: S = t_z(cos 135° − cos 45°) + t_x(sin 135° + sin 45°) = √2(t_x − t_z) (from E above).
    expect(swapped.s).toBeCloseTo(Math.SQRT2 * (T.x - T.z), 3);
    const partial = await f.clients.viewer.get(path(bellRunId, "?aDeg=0")).expect(400);
    expect(partial.body.error.details.map((d: { field: string }) => d.field).sort()).toEqual(["aPrimeDeg", "bDeg", "bPrimeDeg"]);
    const missing = await f.clients.viewer.get(path(bellRunId, "?aDeg=10&aPrimeDeg=45&bDeg=22.5&bPrimeDeg=67.5")).expect(400);
    expect(missing.body.error.details[0]).toMatchObject({ field: "rows" });
    expect(missing.body.error.message).toMatch(/no row was measured at A 10°, B 22\.5°/);
  });

  it("refuses a run of another kind and names the bad row of a Bell run", async () => {
    const wrong = await f.clients.viewer.get(path(tomographyRunId)).expect(400);
    expect(wrong.body.error.details).toEqual([{ field: "runId", message: "This is a tomography run; this analysis is for bell runs." }]);
    const rows = bellRows(3);
    rows[6] = { ...rows[6], setting: [{ qwpDeg: 0, hwpDeg: 0 }, { qwpDeg: 0, hwpDeg: 22.5 }] };
    const badId = (await f.clients.member.post(`/api/labs/${lab}/sessions/${sessionId}/runs`, { kind: "bell", settingSetId: "custom", name: "Misset", rows }).expect(201)).body.id;
    const bad = await f.clients.viewer.get(path(badId)).expect(400);
    expect(bad.body.error.message).toMatch(/row 7, arm B: QWP 0°, HWP 22\.5° analyse an elliptical polarisation/);
  });

  it("says so when the session has no reconstructed state", async () => {
    const sourceId = (await f.clients.member.post(`/api/labs/${lab}/sources`, { name: "Second source" }).expect(201)).body.id;
    const lone = (await f.clients.member.post(`/api/labs/${lab}/sessions`, { sourceId, title: "Bell only", date: "2026-03-05" }).expect(201)).body.id;
    const runId = (await f.clients.member.post(`/api/labs/${lab}/sessions/${lone}/runs`, { kind: "bell", settingSetId: "custom", name: "CHSH alone", rows: bellRows(5) }).expect(201)).body.id;
    const b = BellTestSchema.parse((await f.clients.viewer.get(path(runId)).expect(200)).body);
    expect(b.prediction).toBeNull();
    expect(b.predictionNote).toMatch(/no ρ to compare with/);
    expect(Math.abs(b.s - S_EXPECTED)).toBeLessThan(4 * b.sigmaS);
  });

  it("hides the run from outsiders (404) and answers a missing run with 404", async () => {
    await f.clients.outsider.get(path(bellRunId)).expect(404);
    await f.clients.anonymous.get(path(bellRunId)).expect(401);
    await f.clients.viewer.get(path("00000000-0000-4000-8000-000000000000")).expect(404);
  });
});
