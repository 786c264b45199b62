import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { strToU8, zipSync } from "fflate";
import { LIMITS } from "@shared/limits";
import { writeTomographyCsv } from "@shared/formats/tomographyCsv";
import { writeSweepCsv } from "@shared/formats/sweepCsv";
import { BatchSchema } from "@shared/schemas/batches";
import type { CountsRow } from "@shared/physics/types";
import { Run } from "../../server/entities/Run";
import { startBatchWorkers } from "../../server/jobs/workers";
import { stopJobQueue } from "../../server/jobs/queue";
import { withContentLock } from "../../server/jobs/batchFileState";
import { labWithRoles, type LabFixture } from "../support/clients";
import { psiMinusRows, sessionIn } from "../support/notebook";
import { fileNamed, runJson, uploadBatch, waitForBatch } from "../support/batches";
import { startTestApp, type TestApp } from "../support/testApp";

const asRows = (seed: number) => psiMinusRows({ seed }) as CountsRow[];
const sweep = (names: string[], firstSeed: number) => writeSweepCsv(names.map((name, i) => ({ name, pumpPowerMw: i + 1, rows: asRows(firstSeed + i) })));

describe("batch uploads", () => {
  let t: TestApp;
  let f: LabFixture;
  let sessionId: string;
  const runsInSession = () => t.dataSource.getRepository(Run).countBy({ sessionId });

  beforeAll(async () => {
    t = await startTestApp();
    f = await labWithRoles(t);
    ({ sessionId } = await sessionIn(f));
    await startBatchWorkers(2);
  });
  afterAll(async () => {
    await stopJobQueue();
    await t.close();
  });

  // Good and bad files side by side: CSV, JSON, a sweep with one bad row, a zip holding more.
  const goodCsv = { name: "2mW.csv", content: writeTomographyCsv(asRows(2)) };
  const badCsv = { name: "misaligned.csv", content: writeTomographyCsv(asRows(3)).replace(/\nHV,\d+/, "\nHV,-5") };
  const goodJson = { name: "5mW.json", content: runJson("5 mW", psiMinusRows({ seed: 5 })) };
  const badJson = { name: "broken.json", content: runJson("Broken", psiMinusRows({ seed: 6 }).map((r, i) => (i === 4 ? { ...r, counts: 1.5 } : r))) };
  const sweepCsv = { name: "power-sweep.csv", content: sweep(["10 mW", "20 mW", "30 mW"], 10).replace(/\n30 mW,3,(\d+)/, "\n30 mW,3,12x") };
  const zip = {
    name: "day2.zip",
    content: Buffer.from(zipSync({ "day2/7mW.csv": strToU8(writeTomographyCsv(asRows(7))), "day2/8mW.json": strToU8(runJson("8 mW", psiMinusRows({ seed: 8 }))), "day2/notes.docx": strToU8("not a run"), "day2/inner.zip": zipSync({ "x.csv": strToU8("basis,counts\n") }) })),
  };
  const spreadsheet = { name: "counts.xlsx", content: Buffer.from("PK not really") };
  let firstBatchId: string;

  it("stores every good file and gives every bad one its own message naming file, row and column", async () => {
    const before = await runsInSession();
    const res = await uploadBatch(f.clients.member, f.lab.id, sessionId, [goodCsv, badCsv, goodJson, badJson, sweepCsv, zip, spreadsheet]).expect(202);
    const accepted = BatchSchema.parse(res.body);
    firstBatchId = accepted.id;
    expect(accepted.fileCount).toBe(12);
    // Files that cannot be read at all are refused at once; the others wait for a worker.
    expect(accepted.counts.failed).toBe(3);

    const batch = await waitForBatch(f.clients.member, f.lab.id, accepted.id);
    expect(batch.counts).toEqual({ queued: 0, processing: 0, stored: 6, failed: 6, duplicate: 0 });
    expect(await runsInSession()).toBe(before + 6);

    for (const name of ["2mW.csv", "5mW.json", "power-sweep.csv › row 2", "power-sweep.csv › row 3", "day2.zip › day2/7mW.csv", "day2.zip › day2/8mW.json"]) {
      const file = fileNamed(batch, name);
      expect(file.status, name).toBe("stored");
      expect(file.run).not.toBeNull();
    }
    expect(fileNamed(batch, "2mW.csv").run!.name).toBe("2mW");
    expect(fileNamed(batch, "power-sweep.csv › row 2").run!.name).toBe("10 mW");

    expect(fileNamed(batch, "misaligned.csv")).toMatchObject({ status: "failed", issues: [{ row: 3, column: "counts" }] });
    expect(fileNamed(batch, "misaligned.csv").message).toBe(`misaligned.csv: row 3, column "counts": "-5" is not a whole number ≥ 0`);
    expect(fileNamed(batch, "broken.json")).toMatchObject({ status: "failed", issues: [{ row: 5, column: "counts", message: "Counts must be a whole number." }] });
    const badRow = fileNamed(batch, "power-sweep.csv › row 4");
    expect(badRow).toMatchObject({ status: "failed", issues: [{ row: 4, column: "HH" }] });
    expect(badRow.message).toBe('power-sweep.csv › row 4: column "HH": "12x" is not a whole number ≥ 0');
    expect(fileNamed(batch, "day2.zip › day2/notes.docx").message).toMatch(/not a file type Rhomb reads/);
    expect(fileNamed(batch, "day2.zip › day2/inner.zip").message).toMatch(/a zip inside a zip is not unpacked/);
    expect(fileNamed(batch, "counts.xlsx").message).toBe("counts.xlsx: not a file type Rhomb reads: give run files as .csv or .json, or a .zip of them");
  });

  it("stores each run with its reconstructions and the file's bytes, as the notebook does", async () => {
    const batch = await waitForBatch(f.clients.member, f.lab.id, firstBatchId);
    const run = await f.clients.viewer.get(`/api/labs/${f.lab.id}/runs/${fileNamed(batch, "2mW.csv").run!.id}`).expect(200);
    expect(run.body.reconstructions.map((r: { method: string }) => r.method).sort()).toEqual(["linear", "mle"]);
    const mle = run.body.reconstructions.find((r: { method: string }) => r.method === "mle");
    expect(mle.uncertainties.samples).toBe(LIMITS.monteCarloDefault);
    expect(run.body.attachments).toHaveLength(1);
    const bytes = await f.clients.viewer.get(run.body.attachments[0].downloadPath).expect(200);
    expect(bytes.text ?? bytes.body.toString()).toBe(goodCsv.content);
    // A sweep row is kept as a two-line sweep CSV: the header and that row.
    const row = await f.clients.viewer.get(`/api/labs/${f.lab.id}/runs/${fileNamed(batch, "power-sweep.csv › row 2").run!.id}`).expect(200);
    expect(row.body.conditions.pumpPowerMw).toBe(1);
    expect(row.body.attachments[0].fileName).toBe("power-sweep row 2.csv");
  });

  it("recognises files uploaded before by their content and stores nothing twice", async () => {
    const before = await runsInSession();
    const again = { name: "2mW-copy.csv", content: goodCsv.content };
    const res = await uploadBatch(f.clients.owner, f.lab.id, sessionId, [again, goodJson, again, sweepCsv]).expect(202);
    const batch = await waitForBatch(f.clients.owner, f.lab.id, res.body.id);
    expect(batch.counts).toEqual({ queued: 0, processing: 0, stored: 0, failed: 1, duplicate: 5 });
    expect(await runsInSession()).toBe(before);
    const copy = batch.files.find((x) => x.fileName === "2mW-copy.csv")!;
    expect(copy.duplicateOf?.name).toBe("2mW");
    expect(copy.message).toBe("2mW-copy.csv: already stored as run “2mW” in session “Test session” — not stored again");
  });

  it("stores a run whose name is already taken in the session, and says so", async () => {
    // Different counts under a name the first batch stored ("5 mW"): a second run, with a note.
    const sameName = { name: "5mW-again.json", content: runJson("5 mW", psiMinusRows({ seed: 55 })) };
    const fresh = { name: "6mW.json", content: runJson("6 mW", psiMinusRows({ seed: 56 })) };
    const res = await uploadBatch(f.clients.member, f.lab.id, sessionId, [sameName, fresh]).expect(202);
    const batch = await waitForBatch(f.clients.member, f.lab.id, res.body.id);
    expect(batch.counts.stored).toBe(2);
    const byName = Object.fromEntries(batch.files.map((x) => [x.fileName, x]));
    expect(byName["5mW-again.json"].message).toBe("stored, but the session already had a run named “5 mW”: both are kept; tell them apart by their figures or notes, or rename one");
    expect(byName["6mW.json"].message).toBeNull();
    expect(await t.dataSource.getRepository(Run).countBy({ sessionId, name: "5 mW" })).toBe(2);
  });

  it("refuses what is over the limits with a message that says which limit", async () => {
    // A zip bomb: 30 MB of zeros in a few kilobytes.
    const bomb = { name: "bomb.zip", content: Buffer.from(zipSync({ "huge.csv": new Uint8Array(30_000_000) }, { level: 9 })) };
    const tooBig = { name: "big.csv", content: "basis,counts\n" + "HH,1\n".repeat(LIMITS.uploadBytes / 5 + 1) };
    const res = await uploadBatch(f.clients.member, f.lab.id, sessionId, [bomb, tooBig]).expect(202);
    const batch = await waitForBatch(f.clients.member, f.lab.id, res.body.id);
    expect(fileNamed(batch, "bomb.zip").message).toMatch(/more than 100 times its own size.*zip bomb/);
    expect(fileNamed(batch, "big.csv").message).toMatch(/larger than 1 MB/);

    // Sweep rows count one file each: two sweeps of 1,001 runs exceed the 2,000 files of a batch.
    const lines = Array.from({ length: 1001 }, (_, i) => `run ${i},1`).join("\n");
    const wide = (n: string) => ({ name: n, content: `run,HH\n${lines}\n` });
    const over = await uploadBatch(f.clients.member, f.lab.id, sessionId, [wide("a.csv"), wide("b.csv")]).expect(413);
    expect(over.body.error.message).toMatch(/at most 2,000 run files; this upload holds 2,002/);
  });

  it("lets members and owners upload, not viewers or outsiders, and shows progress to the lab", async () => {
    await uploadBatch(f.clients.viewer, f.lab.id, sessionId, [goodCsv]).expect(403);
    await uploadBatch(f.clients.outsider, f.lab.id, sessionId, [goodCsv]).expect(404);
    await uploadBatch(f.clients.anonymous, f.lab.id, sessionId, [goodCsv]).expect(401);
    const list = await f.clients.viewer.get(`/api/labs/${f.lab.id}/batches?sessionId=${sessionId}`).expect(200);
    expect(list.body.data.length).toBeGreaterThanOrEqual(3);
    await f.clients.outsider.get(`/api/labs/${f.lab.id}/batches/${firstBatchId}`).expect(404);
  });

  it("lets a second attempt at the same content wait only so long for the first (then it is retried later)", async () => {
    let release!: () => void;
    const first = withContentLock(f.lab.id, "a".repeat(64), 10, () => new Promise<void>((r) => (release = r)));
    await new Promise((r) => setTimeout(r, 200));
    const started = Date.now();
    await expect(withContentLock(f.lab.id, "a".repeat(64), 1, async () => "ran")).rejects.toThrow(/lock timeout/);
    expect(Date.now() - started).toBeGreaterThanOrEqual(900);
    // Other content is not held up, and the lock is free again once the first attempt ends.
    await expect(withContentLock(f.lab.id, "b".repeat(64), 1, async () => "ran")).resolves.toBe("ran");
    release();
    await first;
    await expect(withContentLock(f.lab.id, "a".repeat(64), 1, async () => "ran")).resolves.toBe("ran");
  });
});
