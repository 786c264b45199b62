/**
 * The bad-input corpus (tests/fixtures/bad-inputs) sent to the real upload doors: the one-file
 * run upload, the batch upload, the acquisition API with a personal token, and the session
 * bundle import. Every file must be answered with a 4xx (for a batch: the file marked failed,
 * as batches report per file) and a message that names the problem — the row and column when
 * there is one — and nothing may be stored: the notebook's tables have as many rows afterwards
 * as before.
 */
import { readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { zipSync } from "fflate";
import { LIMITS } from "@shared/limits";
import { BUNDLE_LIMITS } from "@shared/schemas/bundle";
import { BatchSchema } from "@shared/schemas/batches";
import { startBatchWorkers } from "../../server/jobs/workers";
import { stopJobQueue } from "../../server/jobs/queue";
import { BAD_BUNDLES, BAD_RUN_CSV, BAD_RUN_JSON, INCOMPLETE_RUN_CSV, bytesOf, type BadInput } from "../fixtures/bad-inputs/corpus";
import { TestClient, labWithRoles, type LabFixture } from "../support/clients";
import { psiMinusRows, sessionIn } from "../support/notebook";
import { uploadBatch, waitForBatch, type UploadFile } from "../support/batches";
import { startTestApp, type TestApp } from "../support/testApp";

/** Everything a stored run, session or import would add a row to. */
const NOTEBOOK_TABLES = ["sources", "lab_sessions", "runs", "run_revisions", "reconstructions", "attachments", "audit_entries"] as const;

const EXAMPLE = readFileSync(new URL("../../examples/tomography/sagnac2-5mW-tomo16.csv", import.meta.url));

/** A zip of 20 MB of zeros: about 20 kB, so it would unpack to ~1000 times its size. */
function zipBomb(): Buffer {
  return Buffer.from(zipSync({ "counts.csv": new Uint8Array(20_000_000) }, { level: 9 }));
}

/** A counts file padded with comment lines past the 1 MB a run file may be. */
function oversizedCsv(): Buffer {
  const padding = `# ${"padding ".repeat(12)}\n`.repeat(Math.ceil((LIMITS.uploadBytes + 50_000) / 100));
  return Buffer.concat([Buffer.from(padding), EXAMPLE]);
}

describe("the bad-input corpus at every upload door", () => {
  let t: TestApp;
  let f: LabFixture;
  let sessionId: string;
  let token: TestClient;

  const counts = async () => {
    const [row] = await t.dataSource.query(`SELECT ${NOTEBOOK_TABLES.map((n) => `(SELECT count(*)::int FROM ${n}) AS ${n}`).join(", ")}`);
    return row as Record<(typeof NOTEBOOK_TABLES)[number], number>;
  };
  /** Runs `send` and checks that the notebook's tables are unchanged afterwards. */
  const unchanged = async <T>(send: () => Promise<T>): Promise<T> => {
    const before = await counts();
    const result = await send();
    expect(await counts()).toEqual(before);
    return result;
  };

  beforeAll(async () => {
    t = await startTestApp();
    f = await labWithRoles(t);
    ({ sessionId } = await sessionIn(f));
    const secret = (await f.clients.member.post("/api/tokens", { name: "Acquisition PC, table 2", labId: f.lab.id }).expect(201)).body.secret;
    token = new TestClient(t).withoutCsrf();
    token.setHeader("Authorization", `Bearer ${secret}`);
    await startBatchWorkers(2);
  });
  afterAll(async () => {
    await stopJobQueue();
    await t.close();
  });

  describe("one counts file (POST …/runs/upload)", () => {
    const upload = (bytes: Buffer, filename: string) => f.clients.member.post(`/api/labs/${f.lab.id}/sessions/${sessionId}/runs/upload`).attach("file", bytes, { filename, contentType: "text/csv" });

    it("accepts the clean example file, with and without a UTF-8 BOM (the control: the door is open to good files)", async () => {
      await upload(EXAMPLE, "sagnac2-5mW-tomo16.csv").expect(201);
      const withBom = await upload(Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), EXAMPLE]), "with-bom.csv").expect(201);
      expect(withBom.body.rowCount).toBe(16);
    });

    it.each(BAD_RUN_CSV.map((c) => [c.file, c] as const))("refuses %s, naming row and column", async (_name, c) => {
      const res = await unchanged(() => upload(bytesOf("csv", c.file), c.file));
      expect(res.status, JSON.stringify(res.body)).toBe(400);
      expect(res.body.error.message).toMatch(c.says);
      const [detail] = res.body.error.details;
      expect(detail.field).toBe("file");
      expect(detail.line ?? null).toBe(c.row);
      expect(detail.column ?? null).toBe(c.column);
    });

    it("refuses a file of three settings, which no estimator can reconstruct", async () => {
      const res = await unchanged(() => upload(bytesOf("csv", INCOMPLETE_RUN_CSV.file), INCOMPLETE_RUN_CSV.file));
      expect(res.status, JSON.stringify(res.body)).toBe(400);
      expect(res.body.error.message).toMatch(INCOMPLETE_RUN_CSV.says);
    });

    it("refuses an empty file, an oversized file and a zip bomb", async () => {
      const empty = await unchanged(() => upload(Buffer.alloc(0), "empty.csv"));
      expect(empty.status).toBe(400);
      expect(empty.body.error.message).toMatch(/empty/);

      const big = await unchanged(() => upload(oversizedCsv(), "big.csv"));
      expect(big.status).toBe(413);
      expect(big.body.error.message).toMatch(/larger than/);

      const bomb = await unchanged(() => upload(zipBomb(), "counts.zip"));
      expect(bomb.status).toBe(400);
      expect(bomb.body.error.message).toMatch(/not UTF-8/);
    });
  });

  describe("a batch of them (POST …/batches)", () => {
    const expected = (c: BadInput) => c.inBatch ?? c;

    it("marks every bad file failed with its own message, and stores none of them", async () => {
      const files: UploadFile[] = [
        ...BAD_RUN_CSV.map((c) => ({ name: c.file, content: bytesOf("csv", c.file) })),
        ...BAD_RUN_JSON.map((c) => ({ name: c.file, content: bytesOf("json", c.file) })),
        { name: INCOMPLETE_RUN_CSV.file, content: bytesOf("csv", INCOMPLETE_RUN_CSV.file) },
        { name: "empty.csv", content: Buffer.alloc(0) },
        { name: "big.csv", content: oversizedCsv() },
        { name: "bomb.zip", content: zipBomb() },
        // An old Excel workbook (OLE2 compound file magic), saved instead of exported as CSV.
        { name: "counts.xls", content: Buffer.from([0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1, 0, 0, 0, 0]) },
      ];
      const batch = await unchanged(async () => {
        const res = await uploadBatch(f.clients.member, f.lab.id, sessionId, files);
        expect(res.status, JSON.stringify(res.body).slice(0, 500)).toBe(202);
        return waitForBatch(f.clients.member, f.lab.id, BatchSchema.parse(res.body).id, 120_000);
      });
      expect(batch.counts).toMatchObject({ stored: 0, duplicate: 0, failed: files.length });

      const byName = new Map(batch.files.map((x) => [x.fileName, x]));
      for (const c of [...BAD_RUN_CSV, ...BAD_RUN_JSON]) {
        const file = byName.get(c.file);
        expect(file, c.file).toBeDefined();
        const { row, column, says } = expected(c);
        expect(file!.message, c.file).toMatch(says);
        expect(file!.message!.startsWith(c.file), `${c.file}: ${file!.message}`).toBe(true);
        expect(file!.issues.map((i) => ({ row: i.row, column: i.column })), c.file).toContainEqual({ row, column });
      }
      expect(byName.get(INCOMPLETE_RUN_CSV.file)!.message).toMatch(INCOMPLETE_RUN_CSV.says);
      expect(byName.get("empty.csv")!.message).toMatch(/empty/);
      expect(byName.get("big.csv")!.message).toMatch(/larger than 1 MB/);
      expect(byName.get("bomb.zip")!.message).toMatch(/zip bomb/);
      expect(byName.get("counts.xls")!.message).toMatch(/not a file type Rhomb reads/);
    }, 180_000);
  });

  describe("the acquisition API with a personal token (POST …/acquisitions)", () => {
    // The bytes as they are: superagent would otherwise serialise a Buffer as JSON.
    const post = (bytes: Buffer, contentType = "application/json") => token.post(`/api/labs/${f.lab.id}/sessions/${sessionId}/acquisitions`).set("Content-Type", contentType).serialize((b) => b as string).send(bytes);
    /** The API names a problem by its JSON path: rows.<index>.<key>, or the key itself. */
    const fieldOf = (c: BadInput) => [...(c.row !== null ? ["rows", String(c.row - 1)] : []), ...(c.column ? [c.column] : [])].join(".");
    const bodyLevel = (c: BadInput) => c.row === null && c.column === null;

    it("accepts the clean run (the control)", async () => {
      const good = JSON.parse(bytesOf("json", "string-counts.json").toString("utf8"));
      good.rows[1].counts = 7471;
      await post(Buffer.from(JSON.stringify({ ...good, reconstruction: { monteCarloSamples: 0 } }))).expect(201);
    });

    it.each(BAD_RUN_JSON.filter((c) => !bodyLevel(c)).map((c) => [c.file, c] as const))("refuses %s, naming the field", async (_name, c) => {
      const res = await unchanged(() => post(bytesOf("json", c.file)));
      expect(res.status, JSON.stringify(res.body)).toBe(400);
      const messages = res.body.error.details.filter((d: { field: string }) => d.field === fieldOf(c)).map((d: { message: string }) => d.message);
      expect(messages.some((m: string) => c.says.test(m)), JSON.stringify(res.body.error.details)).toBe(true);
      expect(JSON.stringify(res.body)).not.toMatch(/Cannot read properties|undefined/);
    });

    it.each(BAD_RUN_JSON.filter(bodyLevel).map((c) => [c.file, c] as const))("refuses %s as a body it cannot read", async (_name, c) => {
      const res = await unchanged(() => post(bytesOf("json", c.file)));
      expect(res.status, JSON.stringify(res.body)).toBe(400);
      // JSON syntax and encoding are judged by the body parser before the run is: its words, not the file reader's.
      expect(res.body.error.message).toMatch(c.file === "top-level-array.json" ? /one JSON object/ : /not valid JSON|not UTF-8/);
    });

    it("refuses an empty body, an oversized body and a zip bomb", async () => {
      const empty = await unchanged(() => post(Buffer.alloc(0)));
      expect(empty.status).toBe(400);
      expect(empty.body.error.details.map((d: { field: string }) => d.field)).toContain("rows");

      const big = await unchanged(() => post(Buffer.from(JSON.stringify({ rows: psiMinusRows(), notes: "x".repeat(2_100_000) }))));
      expect(big.status).toBe(413);
      expect(big.body.error.message).toMatch(/larger than the limit/);

      const bomb = await unchanged(() => post(zipBomb()));
      expect(bomb.status).toBe(400);
      expect(bomb.body.error.message).toMatch(/not UTF-8/);
    });
  });

  describe("a session bundle (POST …/bundles)", () => {
    let exported: string;
    const importBundle = (bytes: Buffer) => f.clients.member.post(`/api/labs/${f.lab.id}/bundles`).attach("bundle", bytes, { filename: "session.rhomb.json", contentType: "application/json" });
    const changed = (edit: (b: Record<string, any>) => void) => {
      const b = JSON.parse(exported);
      edit(b);
      return Buffer.from(JSON.stringify(b));
    };
    const firstRows = (b: Record<string, any>) => b.runs[0].revisions[0].rows as Array<Record<string, unknown>>;

    beforeAll(async () => {
      await f.clients.member.post(`/api/labs/${f.lab.id}/sessions/${sessionId}/runs`, { kind: "tomography", settingSetId: "tomo16", name: "Bundled run", rows: psiMinusRows(), reconstruction: { monteCarloSamples: 0 } }).expect(201);
      exported = (await f.clients.member.get(`/api/labs/${f.lab.id}/sessions/${sessionId}/bundle`).expect(200)).text;
    });

    it("imports the unchanged export (the control)", async () => {
      const res = await importBundle(Buffer.from(exported)).expect(201);
      expect(res.body.runs).toBeGreaterThan(0);
    });

    it.each(BAD_BUNDLES.map((c) => [c.file, c] as const))("refuses %s", async (_name, c) => {
      const res = await unchanged(() => importBundle(bytesOf("bundle", c.file)));
      expect(res.status, JSON.stringify(res.body)).toBe(400);
      expect(res.body.error.message).toMatch(/Nothing was imported/);
      expect(res.body.error.details.find((d: { field: string }) => d.field === c.field)?.message).toMatch(c.says);
    });

    const broken: Array<[string, () => Buffer, string, RegExp]> = [
      ["negative counts in a revision", () => changed((b) => (firstRows(b)[3].counts = -5)), "runs.0.revisions.0.rows.3.counts", /negative/],
      ["text in counts", () => changed((b) => (firstRows(b)[2].counts = "12x")), "runs.0.revisions.0.rows.2.counts", /number/],
      ["huge counts", () => changed((b) => (firstRows(b)[1].counts = 1e300)), "runs.0.revisions.0.rows.1.counts", /large/],
      ["an unknown basis letter", () => changed((b) => (firstRows(b)[5].setting = "HX")), "runs.0.revisions.0.rows.5.setting", /letters/],
      ["a duplicated setting", () => changed((b) => (firstRows(b)[6].setting = firstRows(b)[0].setting)), "runs.0.revisions.0.rows.6.setting", /twice/],
      ["a missing setting", () => changed((b) => firstRows(b).splice(4, 1)), "runs.0.revisions.0.rows", /missing/],
      ["NaN where JSON has none", () => Buffer.from(exported.replace(/"counts": \d+/, '"counts": NaN')), "bundle", /not valid JSON/],
      ["a cut-off file", () => Buffer.from(exported.slice(0, Math.floor(exported.length / 2))), "bundle", /not valid JSON/],
      ["UTF-16", () => Buffer.from(`\ufeff${exported}`, "utf16le"), "bundle", /not UTF-8|not valid JSON/],
      ["Latin-1 bytes in the title", () => Buffer.from(changed((b) => (b.session.title = "Justage Jürgen, 25 °C")).toString("utf8"), "latin1"), "bundle", /not UTF-8/],
      ["an empty file", () => Buffer.alloc(0), "bundle", /./],
      ["a zip bomb", () => zipBomb(), "bundle", /not UTF-8|not valid JSON/],
    ];
    it.each(broken)("refuses a bundle with %s, naming the field", async (_name, bytes, field, says) => {
      const res = await unchanged(() => importBundle(bytes()));
      expect(res.status, JSON.stringify(res.body)).toBe(400);
      const messages = (res.body.error.details ?? []).filter((d: { field: string }) => d.field === field).map((d: { message: string }) => d.message);
      expect(messages.some((m: string) => says.test(m)), JSON.stringify(res.body.error)).toBe(true);
    });

    it("refuses a bundle over the size limit before reading it", async () => {
      const big = Buffer.concat([Buffer.from(exported), Buffer.alloc(BUNDLE_LIMITS.bytes + 1000 - exported.length, 0x20)]);
      const res = await unchanged(() => importBundle(big));
      expect(res.status).toBe(413);
      expect(res.body.error.message).toMatch(/larger than/);
    });
  });
});
