import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { RunDetailSchema, RunPageSchema } from "@shared/schemas/runs";
import { AuditEntry, Reconstruction, Run, RunRevision } from "../../server/entities/index";
import { labWithRoles, type LabFixture } from "../support/clients";
import { psiMinusRows, sessionIn } from "../support/notebook";
import { startTestApp, type TestApp } from "../support/testApp";

/**
 * Expected values: the counts are drawn from the Werner state p·ψ⁻ + (1−p)·I/4, whose fidelity
 * to ψ⁻ is (1 + 3p)/4 (Werner, Phys. Rev. A 40, 4277 (1989); physics contract §6), so p = 0.95
 * gives 0.9625; accidentals (≈ 11 per setting against ≈ 5000 coincidences) lower it by ≈ 0.002.
 */
describe("runs", () => {
  let t: TestApp;
  let f: LabFixture;
  let lab: string;
  let sessionId: string;
  beforeAll(async () => {
    t = await startTestApp();
    f = await labWithRoles(t);
    lab = f.lab.id;
    ({ sessionId } = await sessionIn(f));
  });
  afterAll(() => t.close());

  const post = (body: object, client = f.clients.member) => client.post(`/api/labs/${lab}/sessions/${sessionId}/runs`, body);
  const count = async () => ({ runs: await t.dataSource.getRepository(Run).count(), revisions: await t.dataSource.getRepository(RunRevision).count(), reconstructions: await t.dataSource.getRepository(Reconstruction).count() });

  it("saves a run exactly as entered with linear and maximum-likelihood reconstructions and Monte Carlo σ", async () => {
    const rows = psiMinusRows();
    const res = await post({ settingSetId: "tomo16", name: "5 mW", rows, conditions: { pumpPowerMw: 5 } }).expect(201);
    const run = RunDetailSchema.parse(res.body);
    expect(run.rows).toEqual(rows.map((r) => ({ ...r, monitor: null })));
    expect(run.revisionNumber).toBe(1);
    expect(run.revisions.map((r) => r.number)).toEqual([1]);
    expect(run.reconstructions.map((r) => r.method).sort()).toEqual(["linear", "mle"]);
    const mle = run.reconstructions.find((r) => r.method === "mle")!;
    expect(mle.uncertainties?.samples).toBe(200);
    expect(typeof mle.uncertainties?.seed).toBe("number");
    const f0 = mle.metrics.fidelityPsiMinus!;
    const sigma = mle.uncertainties!.metrics.fidelityPsiMinus!;
    expect(f0).toBeGreaterThan(0.9);
    expect(Math.abs(f0 - (0.9625 - 0.002))).toBeLessThan(4 * sigma);
    // The spread of the MLE fidelity over 200 independent simulated runs of this state was 0.0067
    // (measured once with the engine); Monte Carlo from one run must land near it.
    expect(sigma).toBeGreaterThan(0.0067 / 2);
    expect(sigma).toBeLessThan(0.0067 * 2);
    expect(mle.fit.converged).toBe(true);
    expect(mle.physical).toBe(true);
    expect(mle.eigenvalues).toHaveLength(4);
    expect(mle.conventions.handedness).toBe("R=H+iV");
    expect(run.headline).toMatchObject({ method: "mle", reconstructionId: mle.id, accidentalsSubtracted: false });
    expect(run.headline!.fidelity).toBeCloseTo(f0, 12);
    expect(run.conditions.pumpPowerMw).toBe(5);
    const audit = await t.dataSource.getRepository(AuditEntry).findOneByOrFail({ entityId: run.id, action: "run.create" });
    expect(audit.actorId).toBe(f.users.member.id);
  });

  it("rejects a bad row naming row and column, and stores nothing", async () => {
    const before = await count();
    const rows = psiMinusRows();
    rows[3] = { ...rows[3], counts: -4 };
    rows[5] = { ...rows[5], setting: "HQ" };
    const res = await post({ settingSetId: "tomo16", name: "bad", rows }).expect(400);
    expect(res.body.error.code).toBe("invalid");
    expect(res.body.error.details).toEqual([
      { field: "rows.3.counts", message: "Counts cannot be negative." },
      { field: "rows.5.setting", message: "Setting is 1–4 letters from H, V, D, A, R, L (photon A first), e.g. HV." },
    ]);
    expect(await count()).toEqual(before);
  });

  it("says which setting of the standard set is missing or repeated", async () => {
    const rows = psiMinusRows();
    rows[15] = { ...rows[15], setting: "HH" };
    const res = await post({ settingSetId: "tomo16", name: "dup", rows }).expect(400);
    expect(res.body.error.details).toEqual([
      { field: "rows.15.setting", message: "HH appears twice (rows 1 and 16)." },
      { field: "rows", message: "The tomo16 set needs 16 rows; missing: RL." },
    ]);
  });

  it("refuses accidental subtraction without singles, naming the first row that lacks them; nothing stored", async () => {
    const before = await count();
    const rows = psiMinusRows({ singles: false });
    const res = await post({ settingSetId: "tomo16", name: "no singles", rows, reconstruction: { corrections: { accidentals: true } } }).expect(400);
    expect(res.body.error.details[0].field).toBe("rows.0.singlesA");
    expect(await count()).toEqual(before);
  });

  it("refuses a custom set that does not determine the state, and stores nothing", async () => {
    const before = await count();
    const rows = psiMinusRows().slice(0, 6);
    const res = await post({ settingSetId: "custom", name: "too few", rows }).expect(400);
    expect(res.body.error.details[0].field).toBe("rows");
    expect(res.body.error.message).toMatch(/not informationally complete/);
    expect(await count()).toEqual(before);
  });

  it("corrects counts as a new revision, keeps the old one untouched, and records who changed which cell", async () => {
    const rows = psiMinusRows({ seed: 11 });
    const created = RunDetailSchema.parse((await post({ settingSetId: "tomo16", name: "typo run", rows }).expect(201)).body);
    const fixed = rows.map((r, i) => (i === 2 ? { ...r, counts: r.counts + 100 } : r));
    const res = await f.clients.owner.post(`/api/labs/${lab}/runs/${created.id}/revisions`, { reason: "VV typed wrong", rows: fixed }).expect(201);
    const run = RunDetailSchema.parse(res.body);
    expect(run.revisionNumber).toBe(2);
    expect(run.rows[2].counts).toBe(rows[2].counts + 100);
    expect(run.revisions).toHaveLength(2);
    expect(run.revisions[0].rows).toEqual(created.rows);
    expect(run.revisions[1]).toMatchObject({ number: 2, reason: "VV typed wrong", changes: [{ row: 2, field: "counts", from: rows[2].counts, to: rows[2].counts + 100 }] });
    expect(run.revisions[1].createdBy?.id).toBe(f.users.owner.id);
    // Old reconstructions stay (tied to revision 1); new ones belong to revision 2.
    expect(run.reconstructions.map((r) => r.revisionNumber).sort()).toEqual([1, 1, 2, 2]);
    expect(run.headline?.reconstructionId).toBe(run.reconstructions.find((r) => r.revisionNumber === 2 && r.method === "mle")!.id);
  });

  it("cannot overwrite raw counts, not even with SQL", async () => {
    const run = RunDetailSchema.parse((await post({ settingSetId: "tomo16", name: "frozen", rows: psiMinusRows({ seed: 3 }), reconstruction: { monteCarloSamples: 0 } }).expect(201)).body);
    await expect(t.dataSource.query(`UPDATE run_revisions SET rows = '[]' WHERE run_id = $1`, [run.id])).rejects.toThrow(/immutable/);
    await expect(t.dataSource.query(`UPDATE reconstructions SET rho = '{}' WHERE run_id = $1`, [run.id])).rejects.toThrow(/immutable/);
    const stored = await t.dataSource.getRepository(RunRevision).findOneByOrFail({ runId: run.id });
    expect(stored.rows).toEqual(run.rows);
  });

  it("edits name, notes and conditions in place, never counts", async () => {
    const run = RunDetailSchema.parse((await post({ settingSetId: "tomo16", name: "to rename", rows: psiMinusRows({ seed: 4 }), reconstruction: { monteCarloSamples: 0 } }).expect(201)).body);
    const res = await f.clients.member.patch(`/api/labs/${lab}/runs/${run.id}`, { name: "renamed", conditions: { crystalTemperatureC: 31 } }).expect(200);
    expect(res.body).toMatchObject({ name: "renamed", conditions: { pumpPowerMw: null, crystalTemperatureC: 31, compensatorTiltDeg: null }, revisionNumber: 1 });
    const refused = await f.clients.member.patch(`/api/labs/${lab}/runs/${run.id}`, { rows: [] }).expect(400);
    expect(refused.body.error.code).toBe("invalid");
    const audit = await t.dataSource.getRepository(AuditEntry).findOneByOrFail({ entityId: run.id, action: "run.update" });
    expect(audit.changes).toMatchObject({ name: { from: "to rename", to: "renamed" } });
  });

  it("lets viewers read runs but not write; outsiders get 404 everywhere", async () => {
    const run = RunDetailSchema.parse((await post({ settingSetId: "tomo16", name: "guarded", rows: psiMinusRows({ seed: 5 }), reconstruction: { monteCarloSamples: 0 } }).expect(201)).body);
    const viewed = await f.clients.viewer.get(`/api/labs/${lab}/runs/${run.id}`).expect(200);
    expect(viewed.body.can).toEqual({ read: true, write: false, manage: false });
    await f.clients.viewer.post(`/api/labs/${lab}/sessions/${sessionId}/runs`, { settingSetId: "tomo16", name: "x", rows: psiMinusRows() }).expect(403);
    await f.clients.viewer.post(`/api/labs/${lab}/runs/${run.id}/revisions`, { reason: "x", rows: run.rows }).expect(403);
    await f.clients.viewer.patch(`/api/labs/${lab}/runs/${run.id}`, { name: "x" }).expect(403);
    await f.clients.outsider.get(`/api/labs/${lab}/runs/${run.id}`).expect(404);
    await f.clients.outsider.get(`/api/labs/${f.otherLab.id}/runs/${run.id}`).expect(404);
    await f.clients.outsider.post(`/api/labs/${lab}/sessions/${sessionId}/runs`, { settingSetId: "tomo16", name: "x", rows: psiMinusRows() }).expect(404);
  });

  it("lists runs with key figures: filter by session and kind, sort by fidelity, page", async () => {
    const { sessionId: other } = await sessionIn(f);
    for (const [p, name] of [[0.7, "p=0.7"], [0.9, "p=0.9"], [0.8, "p=0.8"]] as const) {
      await f.clients.member.post(`/api/labs/${lab}/sessions/${other}/runs`, { settingSetId: "tomo16", name, rows: psiMinusRows({ p }), reconstruction: { monteCarloSamples: 0 } }).expect(201);
    }
    const byFidelity = RunPageSchema.parse((await f.clients.viewer.get(`/api/labs/${lab}/runs?sessionId=${other}&sort=fidelity&order=desc`).expect(200)).body);
    expect(byFidelity.data.map((r) => r.name)).toEqual(["p=0.9", "p=0.8", "p=0.7"]);
    expect(byFidelity.page.total).toBe(3);
    const f9 = byFidelity.data[0].headline!.fidelity!;
    expect(Math.abs(f9 - (1 + 3 * 0.9) / 4)).toBeLessThan(0.01);
    const page = RunPageSchema.parse((await f.clients.viewer.get(`/api/labs/${lab}/runs?sessionId=${other}&sort=name&order=asc&pageSize=2&page=2`).expect(200)).body);
    expect(page.data.map((r) => r.name)).toEqual(["p=0.9"]);
    const bell = RunPageSchema.parse((await f.clients.viewer.get(`/api/labs/${lab}/runs?sessionId=${other}&kind=bell`).expect(200)).body);
    expect(bell.data).toEqual([]);
    const searched = RunPageSchema.parse((await f.clients.viewer.get(`/api/labs/${lab}/runs?q=p%3D0.8`).expect(200)).body);
    expect(searched.data.map((r) => r.name)).toEqual(["p=0.8"]);
  });
});
