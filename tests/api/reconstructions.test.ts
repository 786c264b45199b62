import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ReconstructionSchema } from "@shared/schemas/reconstructions";
import { RunDetailSchema, type RunDetailDto } from "@shared/schemas/runs";
import { AuditEntry, Reconstruction } from "../../server/entities/index";
import { labWithRoles, type LabFixture } from "../support/clients";
import { psiMinusRows, sessionIn } from "../support/notebook";
import { startTestApp, type TestApp } from "../support/testApp";

/**
 * Counts of the Werner state p·ψ⁻ + (1−p)·I/4 with F(ψ⁻) = (1 + 3p)/4 and C = (3p − 1)/2
 * (Werner, Phys. Rev. A 40, 4277 (1989); physics contract §6). The accidentals simulated here
 * are ≈ 11 per setting against ≈ 5000 coincidences (common-practice formula A = s_a·s_b·τ/t,
 * physics contract §3), so subtracting them moves F up by ≈ 0.0016.
 */
describe("reconstructions", () => {
  let t: TestApp;
  let f: LabFixture;
  let lab: string;
  let run: RunDetailDto;
  beforeAll(async () => {
    t = await startTestApp();
    f = await labWithRoles(t);
    lab = f.lab.id;
    const { sessionId } = await sessionIn(f);
    run = RunDetailSchema.parse((await f.clients.member.post(`/api/labs/${lab}/sessions/${sessionId}/runs`, { settingSetId: "tomo16", name: "base", rows: psiMinusRows({ p: 0.9, seed: 31 }), reconstruction: { monteCarloSamples: 0 } }).expect(201)).body);
  });
  afterAll(() => t.close());

  const url = () => `/api/labs/${lab}/runs/${run.id}/reconstructions`;

  it("adds a reconstruction with accidentals subtracted (window from the session) and keeps the old ones", async () => {
    const res = await f.clients.member.post(url(), { method: "mle", corrections: { accidentals: true }, monteCarloSamples: 50, seed: 1234 }).expect(201);
    const rec = ReconstructionSchema.parse(res.body);
    expect(rec.corrections).toEqual({ accidentals: true, windowNs: 3, efficiencies: null, drift: "none" });
    expect(rec.uncertainties).toMatchObject({ samples: 50, seed: 1234 });
    expect(rec.revisionNumber).toBe(1);
    const before = run.reconstructions.find((r) => r.method === "mle")!;
    expect(rec.metrics.fidelityPsiMinus! - before.metrics.fidelityPsiMinus!).toBeGreaterThan(0);
    expect(rec.metrics.fidelityPsiMinus! - before.metrics.fidelityPsiMinus!).toBeLessThan(0.005);
    expect(Math.abs(rec.metrics.fidelityPsiMinus! - (1 + 3 * 0.9) / 4)).toBeLessThan(0.02);
    expect(Math.abs(rec.metrics.concurrence! - (3 * 0.9 - 1) / 2)).toBeLessThan(0.04);
    const detail = RunDetailSchema.parse((await f.clients.viewer.get(`/api/labs/${lab}/runs/${run.id}`).expect(200)).body);
    expect(detail.reconstructions).toHaveLength(3);
    expect(detail.reconstructions[0].id).toBe(rec.id);
    expect(detail.headline).toMatchObject({ reconstructionId: rec.id, accidentalsSubtracted: true });
    expect(await t.dataSource.getRepository(AuditEntry).countBy({ entityId: rec.id, action: "reconstruction.create" })).toBe(1);
  });

  it("reproduces the Monte Carlo uncertainties from the stored seed", async () => {
    const body = { method: "linear", monteCarloSamples: 40, seed: 99 };
    const a = ReconstructionSchema.parse((await f.clients.member.post(url(), body).expect(201)).body);
    const b = ReconstructionSchema.parse((await f.clients.member.post(url(), body).expect(201)).body);
    expect(a.id).not.toBe(b.id);
    expect(b.uncertainties).toEqual(a.uncertainties);
    const c = ReconstructionSchema.parse((await f.clients.member.post(url(), { ...body, seed: 100 }).expect(201)).body);
    expect(c.uncertainties!.metrics.fidelityPsiMinus).not.toBe(a.uncertainties!.metrics.fidelityPsiMinus);
  });

  it("flags a non-physical linear estimate; projected least squares and MLE of the same counts are physical", async () => {
    // A pure ψ⁻ with few counts: linear inversion's estimate then has a negative eigenvalue
    // (checked once for this seed: λ_min ≈ −0.019); the constrained estimators cannot.
    const { sessionId } = await sessionIn(f);
    const pure = RunDetailSchema.parse((await f.clients.member.post(`/api/labs/${lab}/sessions/${sessionId}/runs`, { settingSetId: "tomo16", name: "pure", rows: psiMinusRows({ p: 1, pairRate: 2000, seed: 1 }), reconstruction: { monteCarloSamples: 0 } }).expect(201)).body);
    const linear = pure.reconstructions.find((r) => r.method === "linear")!;
    expect(linear.physical).toBe(false);
    expect(Math.min(...linear.eigenvalues)).toBeLessThan(0);
    expect(linear.warnings.map((w) => w.code)).toContain("not_physical");
    expect(pure.reconstructions.find((r) => r.method === "mle")!.physical).toBe(true);
    const projected = ReconstructionSchema.parse((await f.clients.member.post(`/api/labs/${lab}/runs/${pure.id}/reconstructions`, { method: "projected", monteCarloSamples: 0 }).expect(201)).body);
    expect(projected.physical).toBe(true);
    expect(Math.min(...projected.eigenvalues)).toBeGreaterThanOrEqual(-1e-10);
    expect(projected.uncertainties).toBeNull();
  });

  it("names the bad parameter and stores nothing", async () => {
    const count = () => t.dataSource.getRepository(Reconstruction).countBy({ runId: run.id });
    const before = await count();
    const wrongLength = await f.clients.member.post(url(), { method: "mle", corrections: { efficiencies: [1, 1, 1] } }).expect(400);
    expect(wrongLength.body.error.details).toEqual([{ field: "corrections.efficiencies", message: "Give one efficiency per row: 16 values, not 3." }]);
    const badMethod = await f.clients.member.post(url(), { method: "bayesian" }).expect(400);
    expect(badMethod.body.error.details[0]).toEqual({ field: "method", message: "Method is linear, mle or projected." });
    const oneSample = await f.clients.member.post(url(), { method: "mle", monteCarloSamples: 1 }).expect(400);
    expect(oneSample.body.error.details[0].field).toBe("monteCarloSamples");
    const drift = await f.clients.member.post(url(), { method: "mle", corrections: { drift: "monitor" } }).expect(400);
    expect(drift.body.error.details[0].field).toBe("rows.0.monitor");
    expect(await count()).toBe(before);
  });

  it("reads one reconstruction; viewers cannot add one; other labs get 404", async () => {
    const id = run.reconstructions[0].id;
    const one = ReconstructionSchema.parse((await f.clients.viewer.get(`/api/labs/${lab}/reconstructions/${id}`).expect(200)).body);
    expect(one.rho).toEqual(run.reconstructions[0].rho);
    expect(one.can.write).toBe(false);
    await f.clients.viewer.post(url(), { method: "mle" }).expect(403);
    await f.clients.outsider.get(`/api/labs/${lab}/reconstructions/${id}`).expect(404);
    await f.clients.outsider.get(`/api/labs/${f.otherLab.id}/reconstructions/${id}`).expect(404);
  });
});
