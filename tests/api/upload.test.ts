import { createHash } from "node:crypto";
import { readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { LIMITS } from "@shared/limits";
import { simulateCounts } from "@shared/physics";
import { STANDARD_BELL_ANGLES, bellDiagonalState, bellTestSettings } from "@shared/physics/bell";
import { CreateRunSchema, RunDetailSchema } from "@shared/schemas/runs";
import type { User } from "../../server/entities/User";
import { createRun } from "../../server/services/runs";
import { Attachment, AuditEntry, Reconstruction, Run, RunRevision } from "../../server/entities/index";
import { labWithRoles, type LabFixture } from "../support/clients";
import { psiMinusCsv, psiMinusRows, sessionIn } from "../support/notebook";
import { startTestApp, type TestApp } from "../support/testApp";

const asAuth = (u: User) => ({ id: u.id, email: u.email, displayName: u.displayName });

describe("counts file upload", () => {
  let t: TestApp;
  let f: LabFixture;
  let url: string;
  let sessionId: string;
  beforeAll(async () => {
    t = await startTestApp();
    f = await labWithRoles(t);
    ({ sessionId } = await sessionIn(f));
    url = `/api/labs/${f.lab.id}/sessions/${sessionId}/runs/upload`;
  });
  afterAll(() => t.close());

  const csv = (seed = 21) => psiMinusCsv({ seed }, ["sweep point 5 mW"]);
  const stored = async () => ({
    runs: await t.dataSource.getRepository(Run).count(),
    revisions: await t.dataSource.getRepository(RunRevision).count(),
    reconstructions: await t.dataSource.getRepository(Reconstruction).count(),
    attachments: await t.dataSource.getRepository(Attachment).count(),
    audit: await t.dataSource.getRepository(AuditEntry).countBy({ action: "run.upload" }),
  });

  it("stores the run, its reconstructions and the file byte for byte", async () => {
    const text = csv();
    const bytes = Buffer.from(text, "utf8");
    const res = await f.clients.member.post(url).field("pumpPowerMw", "5").attach("file", bytes, { filename: "power-5mW.csv", contentType: "text/csv" }).expect(201);
    const run = RunDetailSchema.parse(res.body);
    expect(run).toMatchObject({ name: "power-5mW", settingSetId: "tomo16", notes: "sweep point 5 mW", rowCount: 16, conditions: { pumpPowerMw: 5 } });
    expect(run.rows).toEqual(psiMinusRows({ seed: 21 }).map((r) => ({ ...r, monitor: null })));
    expect(run.reconstructions.map((r) => r.method).sort()).toEqual(["linear", "mle"]);
    expect(run.attachments).toHaveLength(1);
    const a = run.attachments[0];
    expect(a).toMatchObject({ fileName: "power-5mW.csv", contentType: "text/csv", sizeBytes: bytes.length, sha256: createHash("sha256").update(bytes).digest("hex") });
    const download = await f.clients.viewer.get(a.downloadPath).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on("data", (c: Buffer) => chunks.push(c));
      r.on("end", () => cb(null, Buffer.concat(chunks)));
    }).expect(200);
    expect(Buffer.compare(download.body as Buffer, bytes)).toBe(0);
    expect(download.headers["content-disposition"]).toContain('filename="power-5mW.csv"');
    expect(download.headers["content-type"]).toMatch(/^text\/csv/);
    await f.clients.outsider.get(a.downloadPath).expect(404);
  });

  it("accepts the example files and recognises their setting sets", async () => {
    for (const [file, set, rows] of [["sagnac2-5mW-tomo16.csv", "tomo16", 16], ["sagnac2-5mW-tomo36.csv", "tomo36", 36]] as const) {
      const bytes = readFileSync(new URL(`../../examples/tomography/${file}`, import.meta.url));
      const run = RunDetailSchema.parse((await f.clients.member.post(url).attach("file", bytes, file).expect(201)).body);
      expect([run.settingSetId, run.rowCount, run.attachments[0].sizeBytes]).toEqual([set, rows, bytes.length]);
      expect(run.reconstructions.find((r) => r.method === "mle")!.metrics.fidelityPsiMinus!).toBeGreaterThan(0.9);
    }
  });

  it("serves a file that claimed to be HTML as plain bytes, never as a page", async () => {
    const run = RunDetailSchema.parse((await f.clients.member.post(url).attach("file", Buffer.from(csv(22)), { filename: "sneaky.html", contentType: "text/html" }).expect(201)).body);
    expect(run.attachments[0].contentType).toBe("text/html");
    const res = await f.clients.viewer.get(run.attachments[0].downloadPath).expect(200);
    expect(res.headers["content-type"]).toBe("application/octet-stream");
    expect(res.headers["content-disposition"]).toMatch(/^attachment;/);
  });

  it("rejects a malformed file naming its line and column, and stores nothing", async () => {
    const before = await stored();
    const lines = csv().split("\n");
    lines[5] = lines[5].replace(/^(\w+),\d+/, "$1,12x");
    const res = await f.clients.member.post(url).attach("file", Buffer.from(lines.join("\n")), { filename: "bad.csv", contentType: "text/csv" }).expect(400);
    expect(res.body.error.details).toEqual([{ field: "file", line: 6, column: "counts", message: 'row 6, column "counts": "12x" is not a whole number ≥ 0' }]);
    expect(res.body.error.message).toMatch(/^The file was not saved/);
    expect(await stored()).toEqual(before);
  });

  it("names the file line when a row breaks a set rule (a setting missing from tomo16)", async () => {
    const before = await stored();
    const lines = csv().split("\n").filter((l) => !l.startsWith("RL,"));
    const res = await f.clients.member.post(url).field("settingSetId", "tomo16").attach("file", Buffer.from(lines.join("\n")), { filename: "short.csv" }).expect(400);
    expect(res.body.error.details).toEqual([{ field: "file", message: "The tomo16 set needs 16 rows; missing: RL." }]);
    expect(await stored()).toEqual(before);
  });

  it("rolls everything back when the reconstruction fails after parsing (incomplete custom set)", async () => {
    const before = await stored();
    const six = csv().split("\n").slice(0, 8).join("\n");
    const res = await f.clients.member.post(url).attach("file", Buffer.from(six), { filename: "six.csv" }).expect(400);
    expect(res.body.error.message).toMatch(/not informationally complete/);
    expect(await stored()).toEqual(before);
  });

  it("rolls back run, revision and reconstructions when a later write of the same transaction fails", async () => {
    const before = await stored();
    const input = CreateRunSchema.parse({ settingSetId: "tomo16", name: "half-stored?", rows: psiMinusRows({ seed: 23 }), reconstruction: { monteCarloSamples: 0 } });
    // The attachment is written after run, revision and reconstructions; a sha256 that breaks
    // its CHECK constraint makes that last write fail inside the transaction.
    const file = { fileName: "x.csv", contentType: "text/csv", content: Buffer.from("basis,counts\n"), sha256: "not-a-digest" };
    await expect(createRun(asAuth(f.users.member), f.lab.id, sessionId, input, file)).rejects.toThrow(/attachments_sha256_check/);
    expect(await stored()).toEqual(before);
  });

  it("refuses a missing file, non-UTF-8 bytes and files over the size limit", async () => {
    const none = await f.clients.member.post(url).field("name", "nothing").expect(400);
    expect(none.body.error.details[0].field).toBe("file");
    const latin1 = await f.clients.member.post(url).attach("file", Buffer.from([0x62, 0x61, 0x73, 0x69, 0x73, 0xe9, 0xff]), { filename: "x.csv" }).expect(400);
    expect(latin1.body.error.message).toMatch(/not UTF-8/);
    const big = await f.clients.member.post(url).attach("file", Buffer.alloc(LIMITS.uploadBytes + 1, 0x41), { filename: "big.csv" }).expect(413);
    expect(big.body.error.code).toBe("payload_too_large");
  });

  it("viewers cannot upload; outsiders get 404", async () => {
    await f.clients.viewer.post(url).attach("file", Buffer.from(csv()), { filename: "v.csv" }).expect(403);
    await f.clients.outsider.post(url).attach("file", Buffer.from(csv()), { filename: "o.csv" }).expect(404);
  });
});

describe("a Bell test uploaded as a counts file with waveplate angles", () => {
  let t: TestApp;
  let f: LabFixture;
  let sessionId: string;
  beforeAll(async () => {
    t = await startTestApp();
    f = await labWithRoles(t);
    ({ sessionId } = await sessionIn(f));
  });
  afterAll(() => t.close());

  it("stores a bell run from arm_*_qwp_deg/arm_*_hwp_deg columns and its CHSH value is 2√2 for φ⁺", async () => {
    // φ⁺ at the standard angles gives S = 2√2 (Clauser, Horne, Shimony, Holt, PRL 23, 880 (1969);
    // Tsirelson, Lett. Math. Phys. 4, 93 (1980)); noiseless expectations at a high rate, rounded.
    const settings = bellTestSettings(STANDARD_BELL_ANGLES);
    const rows = simulateCounts({ rho: bellDiagonalState(1, -1, 1), settings, pairRate: 1e9, seconds: 1, seed: 1, noiseless: true });
    const lines = ["# invented test data: φ⁺ at the standard CHSH angles", "arm_a_qwp_deg,arm_a_hwp_deg,arm_b_qwp_deg,arm_b_hwp_deg,counts"];
    for (const r of rows) {
      const [a, b] = r.setting as Array<{ qwpDeg: number; hwpDeg: number }>;
      lines.push([a.qwpDeg, a.hwpDeg, b.qwpDeg, b.hwpDeg, Math.round(r.counts)].join(","));
    }
    const res = await f.clients.member
      .post(`/api/labs/${f.lab.id}/sessions/${sessionId}/runs/upload`)
      .field("kind", "bell")
      .attach("file", Buffer.from(lines.join("\n")), { filename: "chsh.csv", contentType: "text/csv" })
      .expect(201);
    const run = RunDetailSchema.parse(res.body);
    expect(run).toMatchObject({ kind: "bell", settingSetId: "custom", rowCount: 16 });
    const bell = await f.clients.viewer.get(`/api/labs/${f.lab.id}/runs/${run.id}/bell-test`).expect(200);
    expect(bell.body.s).toBeCloseTo(2 * Math.SQRT2, 6);
  });

  it("names the file's row and column when an angle is not a number, and stores nothing", async () => {
    const before = await t.dataSource.getRepository(Run).count();
    const res = await f.clients.member
      .post(`/api/labs/${f.lab.id}/sessions/${sessionId}/runs/upload`)
      .field("kind", "bell")
      .attach("file", Buffer.from("arm_a_qwp_deg,arm_a_hwp_deg,arm_b_qwp_deg,arm_b_hwp_deg,counts\n0,0,0,11.25,100\n0,45,0,zz,90\n"), { filename: "bad.csv", contentType: "text/csv" })
      .expect(400);
    expect(res.body.error.details[0]).toMatchObject({ field: "file", line: 3, column: "arm_b_hwp_deg" });
    expect(await t.dataSource.getRepository(Run).count()).toBe(before);
  });
});
