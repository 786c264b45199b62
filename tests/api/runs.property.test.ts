/**
 * Never a 500: arbitrary request bodies, files and query strings against the real API. Bodies
 * start from a good run and have any field replaced by something odd (tiny or huge numbers,
 * wrong types, NUL and lone-surrogate text, unknown settings, corrections that need missing
 * singles), so most requests get past the schema and reach the engine and the database. Every
 * answer is below 500 with the one error shape, and a stored run holds the counts exactly as
 * sent (raw counts are never altered).
 */
import fc from "fast-check";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { standardSet } from "@shared/physics";
import { labWithRoles, type LabFixture } from "../support/clients";
import { psiMinusRows, sessionIn } from "../support/notebook";
import { startTestApp, type TestApp } from "../support/testApp";

const tomo16 = standardSet("tomo16").labels;

const oddNumber = fc.oneof(
  { weight: 3, arbitrary: fc.constantFrom(0, 1, -1, 0.5, 5e-324, 1e-300, 1e-9, 1e7, 1e15, 1e15 + 1, 2 ** 53, 1e308, Number.MAX_VALUE, -0) },
  { weight: 1, arbitrary: fc.double({ noNaN: true, noDefaultInfinity: true }) },
  { weight: 1, arbitrary: fc.integer({ min: 0, max: 1e6 }) },
);
const oddText = fc.oneof(
  fc.string({ maxLength: 30 }),
  fc.string({ unit: "binary", maxLength: 30 }),
  fc.constantFrom("", " ", "\u0000", "run\u0000name", "\ud800", "a\udfffb", "😀".repeat(40), "x".repeat(200), "<script>", "=1+1"),
);
const oddValue = fc.oneof(oddNumber, oddText, fc.constantFrom(null, true, [], {}, [1, 2]), fc.jsonValue({ maxDepth: 2 }));

/** A good 16-setting run with some fields replaced; Monte Carlo kept small so 100 runs stay quick. */
const runBody = fc
  .record({
    rowEdits: fc.array(fc.tuple(fc.nat(15), fc.constantFrom("counts", "seconds", "singlesA", "singlesB", "monitor", "setting", "efficiency"), fc.oneof(oddNumber, oddValue, fc.constantFrom(...tomo16, "HX", "hv", "HHV"))), { maxLength: 2 }),
    dropRows: fc.nat(16),
    topEdits: fc.array(fc.tuple(fc.constantFrom("name", "notes", "settingSetId", "kind", "conditions"), fc.oneof(oddValue, fc.constantFrom("tomo16", "tomo36", "custom", "bell", "fringe"))), { maxLength: 1 }),
    corrections: fc.oneof({ weight: 2, arbitrary: fc.constant({}) }, { weight: 1, arbitrary: fc.record({ accidentals: fc.constant(true) }) }, { weight: 2, arbitrary: fc.record({ accidentals: fc.boolean(), windowNs: fc.oneof(fc.constant(null), oddNumber), efficiencies: fc.oneof(fc.constant(null), fc.array(oddNumber, { minLength: 16, maxLength: 16 })), drift: fc.constantFrom("none", "monitor", "singles") }, { requiredKeys: [] }) }),
    samples: fc.constantFrom(0, 0, 2, 10),
    seed: fc.nat(),
  })
  .map(({ rowEdits, dropRows, topEdits, corrections, samples, seed }) => {
    const rows: Array<Record<string, unknown>> = psiMinusRows({ seed: seed % 1000 }).map((r) => ({ ...r, monitor: 1 }));
    for (const [i, key, value] of rowEdits) rows[i][key] = value;
    const body: Record<string, unknown> = { kind: "tomography", settingSetId: "tomo16", name: "Property run", rows: dropRows > 13 ? rows.slice(0, 16 - dropRows) : rows, reconstruction: { corrections, monteCarloSamples: samples } };
    for (const [key, value] of topEdits) body[key] = value;
    return body;
  });

/** Bodies that once answered 500 (a subnormal exposure; drift factors from extreme monitor readings), always tried first. */
const withRow3 = (edit: object, corrections: object = {}) => ({ kind: "tomography", settingSetId: "tomo16", name: "Found", rows: psiMinusRows().map((r, i) => ({ ...r, monitor: 1, ...(i === 3 && edit) })), reconstruction: { corrections, monteCarloSamples: 2 } });
const FOUND = [withRow3({ seconds: 5e-324 }), withRow3({ monitor: 1e308 }, { drift: "monitor" }), withRow3({ monitor: 5e-324 }, { drift: "monitor" })];

describe("the API never answers 500 (fast-check)", () => {
  let t: TestApp;
  let f: LabFixture;
  let sessionId: string;
  beforeAll(async () => {
    t = await startTestApp();
    f = await labWithRoles(t);
    ({ sessionId } = await sessionIn(f));
  });
  afterAll(() => t.close());

  const expectNo500 = (res: { status: number; body: any }, what: unknown) => {
    expect(res.status, `${JSON.stringify(what).slice(0, 2000)}\n→ ${JSON.stringify(res.body).slice(0, 500)}`).toBeLessThan(500);
    if (res.status >= 400) {
      expect(typeof res.body.error?.code).toBe("string");
      expect(res.body.error.message.length).toBeGreaterThan(5);
    }
  };

  it("POST …/runs with odd bodies: a 201 keeping the counts as sent, or a 4xx", async () => {
    const statuses: number[] = [];
    await fc.assert(
      fc.asyncProperty(runBody, async (body) => {
        const res = await f.clients.member.post(`/api/labs/${f.lab.id}/sessions/${sessionId}/runs`, body);
        statuses.push(res.status);
        expectNo500(res, body);
        // As sent over the wire (JSON has no −0).
        const sent = JSON.parse(JSON.stringify(body.rows)) as Array<{ counts: unknown }>;
        if (res.status === 201) expect(res.body.rows.map((r: { counts: number }) => r.counts)).toEqual(sent.map((r) => r.counts));
      }),
      { numRuns: 120, examples: FOUND.map((body) => [body] as [Record<string, unknown>]) },
    );
    // The bodies are meant to reach the engine and the database, not only the schema.
    expect(statuses.filter((s) => s === 201).length).toBeGreaterThan(statuses.length / 10);
  }, 600_000);

  it("POST …/runs/upload with arbitrary bytes and form fields: never a 500", async () => {
    const csvish = fc.array(fc.tuple(fc.constantFrom(...tomo16, "HX", ""), fc.oneof(fc.integer({ min: 0, max: 1e6 }).map(String), fc.constantFrom("5e-324", "1e7", "-1", "x", "")), fc.constantFrom("1", "5e-324", "1e-300", "0.001", "")), { minLength: 1, maxLength: 20 }).map((rows) => `basis,counts,seconds\n${rows.map((r) => r.join(",")).join("\n")}\n`);
    const bytes = fc.oneof(csvish.map((s) => Buffer.from(s)), fc.uint8Array({ maxLength: 300 }).map((b) => Buffer.from(b)), fc.string({ unit: "binary", maxLength: 200 }).map((s) => Buffer.from(s)));
    const field = fc.option(fc.oneof(oddText, oddNumber.map(String)), { nil: undefined });
    await fc.assert(
      fc.asyncProperty(bytes, field, field, fc.string({ maxLength: 40 }), async (content, name, pump, filename) => {
        let req = f.clients.member.post(`/api/labs/${f.lab.id}/sessions/${sessionId}/runs/upload`);
        if (name !== undefined) req = req.field("name", name || "x");
        if (pump !== undefined) req = req.field("pumpPowerMw", pump || "1");
        const res = await req.attach("file", content, { filename: filename.replace(/[\u0000-\u001f"\\]/g, "") || "f.csv", contentType: "text/csv" });
        expectNo500(res, { content: content.toString("latin1").slice(0, 300), name, pump, filename });
      }),
      { numRuns: 120 },
    );
  }, 600_000);

  it("sources, sessions and run lists with odd bodies and query strings: never a 500", async () => {
    const lab = f.lab.id;
    const query = fc.dictionary(fc.constantFrom("page", "pageSize", "sort", "order", "q", "sourceId", "sessionId", "kind", "from", "to"), fc.oneof(oddText, oddNumber.map(String)), { maxKeys: 4 });
    const requests = fc.oneof(
      fc.record({ path: fc.constant(`/api/labs/${lab}/sources`), body: fc.dictionary(fc.constantFrom("name", "description", "targetState", "crystal", "notes"), oddValue) }),
      fc.record({ path: fc.constant(`/api/labs/${lab}/sessions`), body: fc.dictionary(fc.constantFrom("sourceId", "title", "date", "coincidenceWindowNs", "pumpPowerMw", "pumpWavelengthNm", "handedness", "calibration", "notes"), oddValue) }),
      fc.record({ path: fc.constantFrom(`/api/labs/${lab}/runs`, `/api/labs/${lab}/sessions`, `/api/labs/${lab}/sources`, `/api/labs/${lab}/compare`), query }),
    );
    await fc.assert(
      fc.asyncProperty(requests, async (r) => {
        const res = "body" in r ? await f.clients.member.post(r.path, r.body) : await f.clients.member.get(r.path).query(r.query);
        expectNo500(res, r);
      }),
      { numRuns: 150 },
    );
  }, 600_000);
});
