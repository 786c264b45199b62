import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { AcquisitionResultSchema } from "@shared/schemas/batches";
import { RUN_JSON_FORMAT } from "@shared/formats/runJson";
import { Run } from "../../server/entities/Run";
import { stopJobQueue } from "../../server/jobs/queue";
import { TestClient, labWithRoles, type LabFixture } from "../support/clients";
import { psiMinusRows, sessionIn } from "../support/notebook";
import { startTestApp, type TestApp } from "../support/testApp";

describe("acquisition API: one run per request from the acquisition PC, with a token", () => {
  let t: TestApp;
  let f: LabFixture;
  let sessionId: string;
  let token: { id: string; secret: string };
  let pc: TestClient;
  const path = () => `/api/labs/${f.lab.id}/sessions/${sessionId}/acquisitions`;
  const run = (seed: number, extra: object = {}) => ({ format: RUN_JSON_FORMAT, name: `Scan point ${seed}`, settingSetId: "tomo16", conditions: { pumpPowerMw: seed }, rows: psiMinusRows({ seed }), ...extra });

  beforeAll(async () => {
    t = await startTestApp();
    f = await labWithRoles(t);
    ({ sessionId } = await sessionIn(f));
    token = (await f.clients.member.post("/api/tokens", { name: "Acquisition PC", labId: f.lab.id }).expect(201)).body;
    pc = new TestClient(t).withoutCsrf();
    pc.setHeader("Authorization", `Bearer ${token.secret}`);
  });
  afterAll(async () => {
    await stopJobQueue();
    await t.close();
  });

  it("stores the run and answers with its reconstructions, Monte Carlo uncertainties included", async () => {
    const res = await pc.post(path(), run(1)).expect(201);
    const result = AcquisitionResultSchema.parse(res.body);
    expect(result.status).toBe("stored");
    expect(result.run.name).toBe("Scan point 1");
    expect(result.run.createdBy?.id).toBe(f.users.member.id);
    const mle = result.run.reconstructions.find((r) => r.method === "mle")!;
    expect(mle.uncertainties?.samples).toBe(200);
    // psiMinusRows simulates p·ψ⁻ + (1−p)·I/4 with p = 0.95, so the fit lands near F(ψ⁻) = (1 + 3p)/4 ≈ 0.96
    // (Werner fidelity, common practice, no source); only a loose band, the physics is tested elsewhere.
    expect(mle.metrics.fidelityPsiMinus).toBeGreaterThan(0.9);
    expect(result.run.attachments[0]).toMatchObject({ fileName: "Scan point 1.json", contentType: "application/json" });
  });

  it("answers a repeat of the same run (a retry after a lost answer) with the first copy, not a second", async () => {
    const first = AcquisitionResultSchema.parse((await pc.post(path(), run(2)).expect(201)).body);
    const before = await t.dataSource.getRepository(Run).countBy({ sessionId });
    const again = AcquisitionResultSchema.parse((await pc.post(path(), run(2)).expect(200)).body);
    expect(again.status).toBe("duplicate");
    expect(again.run.id).toBe(first.run.id);
    expect(await t.dataSource.getRepository(Run).countBy({ sessionId })).toBe(before);
  });

  it("rejects a bad run with the row and key at fault, and stores nothing", async () => {
    const before = await t.dataSource.getRepository(Run).countBy({ sessionId });
    const rows = psiMinusRows({ seed: 3 }).map((r, i) => (i === 3 ? { ...r, counts: -4 } : r));
    const res = await pc.post(path(), run(3, { rows })).expect(400);
    expect(res.body.error.code).toBe("invalid");
    expect(res.body.error.details).toEqual([{ field: "rows.3.counts", message: "Counts cannot be negative." }]);
    expect(res.body.error.message).toBe('Scan point 3.json: row 4, column "counts": Counts cannot be negative.');
    const engine = await pc.post(path(), run(4, { rows: psiMinusRows({ seed: 4, singles: false }), reconstruction: { corrections: { accidentals: true } } })).expect(400);
    expect(engine.body.error.details[0].field).toMatch(/^rows\.0\.singles[AB]$/);
    expect(await t.dataSource.getRepository(Run).countBy({ sessionId })).toBe(before);
  });

  it("is described in the OpenAPI document as reachable with a token", async () => {
    const doc = (await f.clients.anonymous.get("/api/openapi.json").expect(200)).body;
    const op = doc.paths["/api/labs/{labId}/sessions/{sessionId}/acquisitions"].post;
    expect(op.security).toEqual([{ session: [] }, { token: [] }]);
    expect(doc.paths["/api/labs/{labId}/sessions/{sessionId}/batches"].post.requestBody.content).toHaveProperty(["multipart/form-data"]);
  });

  it("stops accepting runs the moment the token is revoked", async () => {
    await f.clients.member.delete(`/api/tokens/${token.id}`).expect(200);
    const res = await pc.post(path(), run(5)).expect(401);
    expect(res.body.error.message).toMatch(/was revoked/);
  });
});
