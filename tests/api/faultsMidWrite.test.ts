/**
 * The database connection dies in the middle of a multi-statement write: nothing partial stays.
 * Made deterministic with a lock: another connection holds the audit table, so saving an
 * uploaded run writes the run, its revision, its reconstructions and its file and then waits
 * at the audit entry, its last statement; that waiting backend is terminated with
 * pg_terminate_backend, as a crashing or restarted database would end it.
 */
import { readFileSync } from "node:fs";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { labWithRoles, type LabFixture } from "../support/clients";
import { sessionIn } from "../support/notebook";
import { startTestApp, type TestApp } from "../support/testApp";

const TABLES = ["runs", "run_revisions", "reconstructions", "attachments", "audit_entries"] as const;
const EXAMPLE = readFileSync(new URL("../../examples/tomography/sagnac2-5mW-tomo16.csv", import.meta.url));

describe("faults: the connection is terminated in the middle of saving a run", () => {
  let t: TestApp;
  let f: LabFixture;
  let url: string;
  let blocker: pg.Client;

  const counts = async () => {
    const [row] = await t.dataSource.query(`SELECT ${TABLES.map((n) => `(SELECT count(*)::int FROM ${n}) AS ${n}`).join(", ")}`);
    return row as Record<(typeof TABLES)[number], number>;
  };

  beforeAll(async () => {
    t = await startTestApp();
    f = await labWithRoles(t);
    const { sessionId } = await sessionIn(f);
    url = `/api/labs/${f.lab.id}/sessions/${sessionId}/runs/upload`;
    blocker = new pg.Client({ connectionString: process.env.DATABASE_URL });
    await blocker.connect();
  });
  afterAll(async () => {
    await blocker?.end();
    await t?.close();
  });

  it("answers 503, leaves no run, revision, reconstruction, file or audit entry, and the next save works", async () => {
    const before = await counts();
    await blocker.query("BEGIN");
    await blocker.query("LOCK TABLE audit_entries IN ACCESS EXCLUSIVE MODE");
    const pending = f.clients.member.post(url).attach("file", EXAMPLE, { filename: "cut-off.csv", contentType: "text/csv" }).then((r) => r);

    // Wait until the save is queued behind the lock: everything before the audit entry is written.
    let waiting: number | null = null;
    for (let i = 0; i < 600 && waiting === null; i++) {
      const { rows } = await blocker.query(`SELECT pid FROM pg_locks WHERE relation = 'audit_entries'::regclass AND NOT granted`);
      waiting = rows[0]?.pid ?? null;
      if (waiting === null) await new Promise((r) => setTimeout(r, 100));
    }
    expect(waiting, "the save never reached the audit entry").not.toBeNull();
    // Its transaction has inserted into the other tables (it holds their row-exclusive locks).
    const { rows: held } = await blocker.query(`SELECT relation::regclass::text AS t FROM pg_locks WHERE pid = $1 AND mode = 'RowExclusiveLock' AND granted`, [waiting]);
    expect(held.map((r: { t: string }) => r.t)).toEqual(expect.arrayContaining(["runs", "run_revisions", "reconstructions", "attachments"]));
    await blocker.query("SELECT pg_terminate_backend($1)", [waiting]);
    await blocker.query("ROLLBACK");

    const res = await pending;
    expect(res.status, JSON.stringify(res.body)).toBe(503);
    expect(res.body.error.code).toBe("service_unavailable");
    expect(await counts()).toEqual(before);

    // The pool drops the dead connection; the same upload now stores the whole run.
    const again = await f.clients.member.post(url).attach("file", EXAMPLE, { filename: "cut-off.csv", contentType: "text/csv" });
    expect(again.status, JSON.stringify(again.body)).toBe(201);
    const after = await counts();
    expect(after.runs).toBe(before.runs + 1);
    expect(after.attachments).toBe(before.attachments + 1);
    expect(after.reconstructions).toBeGreaterThanOrEqual(before.reconstructions + 2);
  }, 120_000);
});
