import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { resetConfigForTests } from "../../server/config";
import { labWithRoles, type LabFixture } from "../support/clients";
import { psiMinusRows, sessionIn } from "../support/notebook";
import { runJson } from "../support/batches";
import { freePort, startRhombProcess, type RhombProcess } from "../support/processes";
import { startTestApp, type TestApp } from "../support/testApp";

// Lost jobs are retried after this many seconds (the default, 300 s, would make the test wait);
// still well above the few seconds one job takes here.
const JOB_TIMEOUT = "10";
process.env.RHOMB_JOB_TIMEOUT_SECONDS = JOB_TIMEOUT;
resetConfigForTests();

/** Jobs made deliberately slow (1,000 Monte Carlo samples) and many, so a kill lands mid-batch even with a fast engine. */
const slowRuns = (prefix: string, n: number) =>
  Array.from({ length: n }, (_, i) => ({ name: `${prefix}-${i}.json`, content: runJson(`${prefix} ${i}`, psiMinusRows({ seed: 1000 + i + prefix.length * 100 }), { reconstruction: { monteCarloSamples: 1000 } }) }));

describe("restarts in the middle of a batch: every file is stored exactly once", () => {
  let t: TestApp;
  let f: LabFixture;
  let secret: string;
  const alive: RhombProcess[] = [];
  const env = { DATABASE_URL: process.env.DATABASE_URL!, RHOMB_JOB_TIMEOUT_SECONDS: JOB_TIMEOUT, RHOMB_WORKER_CONCURRENCY: "2" };

  beforeAll(async () => {
    t = await startTestApp();
    f = await labWithRoles(t);
    secret = (await f.clients.member.post("/api/tokens", { name: "Restart test", labId: f.lab.id }).expect(201)).body.secret;
  });
  // Each test's processes end with it: a server left running from one test would keep taking
  // the next test's jobs with its in-process workers (which once finished a whole batch that the
  // second test meant a lone worker to finish).
  afterEach(async () => {
    for (const p of alive.splice(0)) {
      if (p.child.exitCode === null && p.child.signalCode === null) p.child.kill("SIGKILL");
      await p.exited;
    }
  });
  afterAll(async () => {
    await t.close();
  });

  const start = async (entry: "server/index.ts" | "server/jobs/worker.ts", extra: Record<string, string> = {}) => {
    const p = await startRhombProcess(entry, { ...env, ...extra }, entry === "server/index.ts" ? "Rhomb is listening" : "Rhomb worker is running");
    alive.push(p);
    return p;
  };

  const upload = async (port: number, sessionId: string, files: { name: string; content: string }[]) => {
    const form = new FormData();
    for (const file of files) form.append("files", new Blob([file.content], { type: "application/json" }), file.name);
    const res = await fetch(`http://127.0.0.1:${port}/api/labs/${f.lab.id}/sessions/${sessionId}/batches`, { method: "POST", headers: { Authorization: `Bearer ${secret}` }, body: form });
    expect(res.status, await res.clone().text()).toBe(202);
    return (await res.json()).id as string;
  };

  const counts = async (batchId: string): Promise<Record<string, number>> => {
    const rows: { status: string; n: string }[] = await t.dataSource.query(`SELECT status, count(*) AS n FROM batch_files WHERE batch_id = $1 GROUP BY status`, [batchId]);
    return Object.fromEntries(rows.map((r) => [r.status, Number(r.n)]));
  };

  const waitFor = async (what: string, ok: () => Promise<boolean>, timeoutMs = 120_000) => {
    const until = Date.now() + timeoutMs;
    while (!(await ok())) {
      if (Date.now() > until) throw new Error(`timed out waiting for ${what}`);
      await new Promise((r) => setTimeout(r, 50));
    }
  };

  /** The checks that matter: as many runs as files, each run claimed by exactly one file, every job completed once. */
  const jobStates = (batchId: string): Promise<{ state: string; n: number }[]> =>
    t.dataSource.query(
      `SELECT state, count(*)::int AS n FROM pgboss.job WHERE name = 'batch-file' AND data->>'batchFileId' IN (SELECT id::text FROM batch_files WHERE batch_id = $1) GROUP BY state`,
      [batchId],
    );

  const expectExactlyOnce = async (batchId: string, sessionId: string, files: number) => {
    expect(await counts(batchId)).toEqual({ stored: files });
    const [runs] = await t.dataSource.query(`SELECT count(*)::int AS n FROM runs WHERE session_id = $1`, [sessionId]);
    expect(runs.n).toBe(files);
    const [links] = await t.dataSource.query(
      `SELECT count(DISTINCT run_id)::int AS distinct_runs, count(*)::int AS files FROM batch_files WHERE batch_id = $1 AND run_id IN (SELECT id FROM runs WHERE session_id = $2)`,
      [batchId, sessionId],
    );
    expect(links).toEqual({ distinct_runs: files, files });
    // A job that was running at the stop may still wait for its retry, which then finds its file
    // finished and completes without doing anything; none may fail.
    await waitFor("every job to complete", async () => (await jobStates(batchId)).every((j) => j.state === "completed"));
    expect(await jobStates(batchId)).toEqual([{ state: "completed", n: files }]);
  };

  it("survives the web server (with its in-process workers) being killed outright and started again", async () => {
    const { sessionId } = await sessionIn(f);
    const port = await freePort();
    const server = await start("server/index.ts", { PORT: String(port), RHOMB_IN_PROCESS_WORKERS: "2" });
    const files = slowRuns("kill", 24);
    const batchId = await upload(port, sessionId, files);
    await waitFor("a few runs stored while others are in progress", async () => {
      const c = await counts(batchId);
      return (c.stored ?? 0) >= 2 && (c.processing ?? 0) >= 1;
    });
    server.child.kill("SIGKILL");
    expect(await server.exited).toBe("SIGKILL");
    const interrupted = await counts(batchId);
    expect(interrupted.processing).toBeGreaterThanOrEqual(1);

    await start("server/index.ts", { PORT: String(port), RHOMB_IN_PROCESS_WORKERS: "2" });
    await waitFor("the batch to finish after the restart", async () => (await counts(batchId)).stored === files.length);
    await expectExactlyOnce(batchId, sessionId, files.length);
    // The files that were in progress at the kill were picked up again.
    const [retried] = await t.dataSource.query(`SELECT count(*)::int AS n FROM batch_files WHERE batch_id = $1 AND attempts >= 2`, [batchId]);
    expect(retried.n).toBeGreaterThanOrEqual(interrupted.processing);
  }, 180_000);

  it("hands unfinished jobs on when a worker stops gracefully, and a worker on its own finishes the batch", async () => {
    const { sessionId } = await sessionIn(f);
    const port = await freePort();
    await start("server/index.ts", { PORT: String(port), RHOMB_IN_PROCESS_WORKERS: "0" });
    const first = await start("server/jobs/worker.ts");
    const files = slowRuns("term", 24);
    const batchId = await upload(port, sessionId, files);
    await waitFor("the worker to get going", async () => ((await counts(batchId)).stored ?? 0) >= 2);
    first.child.kill("SIGTERM");
    expect(await first.exited).toBe(0);
    expect(first.output()).toContain("worker shutting down");
    const meanwhile = await counts(batchId);
    expect(meanwhile.stored).toBeLessThan(files.length);

    await start("server/jobs/worker.ts");
    await waitFor("a second worker to finish the batch", async () => (await counts(batchId)).stored === files.length);
    await expectExactlyOnce(batchId, sessionId, files.length);
  }, 180_000);
});
