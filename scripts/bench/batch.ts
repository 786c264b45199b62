/**
 * `npm run bench:batch`: 1,000 16-setting runs uploaded as one batch, reconstructed (linear
 * inversion and maximum likelihood, 200 Monte Carlo samples each, as any saved run) and stored,
 * timed from the start of the upload to the last file stored. Target: ≤ 60 s on this 2-core
 * machine.
 *
 * Real processes, as in production: the web server (in-process workers off) and
 * `npm run worker` process(es), on a fresh database of the dev cluster (dropped afterwards).
 * While the batch runs, /api/health is probed every 100 ms to show the web process stays
 * responsive. Invented counts (a ψ⁻-like source, Poisson noise, fixed seeds), all different.
 *
 *   npm run bench:batch -- [--runs 1000] [--workers 1] [--concurrency 4] [--json] [--profile DIR]
 *
 * --profile writes V8 CPU profiles of the worker processes (main thread and Monte Carlo
 * threads) into DIR, for Chrome DevTools or any .cpuprofile viewer.
 */
import "reflect-metadata";
import { execFileSync, spawn, type ChildProcess } from "node:child_process";
import { availableParallelism, cpus } from "node:os";
import { parseArgs } from "node:util";
import pg from "pg";
import { simulateCounts, standardSet } from "../../shared/physics";
import { writeTomographyCsv } from "../../shared/formats/tomographyCsv";
import { BatchSchema } from "../../shared/schemas/batches";
import { createDataSource, setDataSource } from "../../server/db/dataSource";
import { Lab, LabMembership, LabSession, Source, User } from "../../server/entities/index";
import { createApiToken } from "../../server/services/apiTokens";
import { wernerLike } from "../../server/db/seeds/demoStates";
import { freePort } from "../../tests/support/processes";

const { values } = parseArgs({
  options: { runs: { type: "string", default: "1000" }, workers: { type: "string", default: "1" }, concurrency: { type: "string", default: "4" }, json: { type: "boolean", default: false }, profile: { type: "string" } },
});
const RUNS = Number(values.runs);
const TARGET_S = 60;

async function main(): Promise<void> {
  const adminUrl = execFileSync("bash", ["scripts/pg.sh", "up", "dev"], { encoding: "utf8" }).trim();
  const name = `rhomb_bench_batch_${process.pid}`;
  const admin = new pg.Client({ connectionString: adminUrl });
  await admin.connect();
  await admin.query(`create database "${name}"`);
  const databaseUrl = adminUrl.replace(/\/postgres$/, `/${name}`);
  const children: ChildProcess[] = [];
  try {
    const { labId, sessionId, secret } = await prepare(databaseUrl);
    const files = Array.from({ length: RUNS }, (_, i) => ({ name: `run-${String(i).padStart(4, "0")}.csv`, content: csvFor(i) }));

    const port = await freePort();
    const env = { DATABASE_URL: databaseUrl, NODE_ENV: "production", SESSION_SECRET: "bench-session-secret-0123456789", LOG_LEVEL: "warn", RHOMB_WORKER_CONCURRENCY: values.concurrency! };
    children.push(await start("server/index.ts", { ...env, PORT: String(port), RHOMB_IN_PROCESS_WORKERS: "0" }, `http://127.0.0.1:${port}/api/health`));
    const profile = values.profile ? ["--cpu-prof", `--cpu-prof-dir=${values.profile}`] : [];
    for (let w = 0; w < Number(values.workers); w++) children.push(await start("server/jobs/worker.ts", env, null, profile));
    await new Promise((r) => setTimeout(r, 1500)); // let the workers' Monte Carlo threads start

    const base = `http://127.0.0.1:${port}`;
    const auth = { Authorization: `Bearer ${secret}` };
    const probe = healthProbe(base);
    const t0 = performance.now();
    const form = new FormData();
    for (const f of files) form.append("files", new Blob([f.content], { type: "text/csv" }), f.name);
    const res = await fetch(`${base}/api/labs/${labId}/sessions/${sessionId}/batches`, { method: "POST", headers: auth, body: form });
    if (res.status !== 202) throw new Error(`upload answered ${res.status}: ${await res.text()}`);
    const accepted = BatchSchema.parse(await res.json());
    const tUpload = performance.now();
    let batch = accepted;
    while (!batch.done) {
      await new Promise((r) => setTimeout(r, 250));
      batch = BatchSchema.parse(await (await fetch(`${base}/api/labs/${labId}/batches/${accepted.id}`, { headers: auth })).json());
    }
    const tDone = performance.now();
    const latencies = await probe.stop();

    const check = await verify(databaseUrl, sessionId);
    const totalS = (tDone - t0) / 1000;
    const report = {
      machine: { cpus: availableParallelism(), cpu: cpus()[0]?.model ?? "unknown", node: process.version },
      runs: RUNS,
      workers: Number(values.workers),
      concurrency: Number(values.concurrency),
      uploadS: (tUpload - t0) / 1000,
      totalS,
      runsPerS: RUNS / totalS,
      counts: batch.counts,
      stored: check,
      health: { probes: latencies.length, p50Ms: pct(latencies, 0.5), p99Ms: pct(latencies, 0.99), maxMs: Math.max(...latencies) },
      targetS: TARGET_S,
      // The target is stated for 1,000 runs; other sizes are for exploring.
      met: RUNS >= 1000 && totalS <= TARGET_S && batch.counts.stored === RUNS,
    };
    if (values.json) process.stdout.write(`${JSON.stringify(report)}\n`);
    else {
      const f = (x: number, d = 1) => x.toFixed(d);
      process.stdout.write(
        [
          `Batch upload — ${report.machine.cpus} cores, ${report.machine.cpu}, Node ${report.machine.node}`,
          `${RUNS} runs (16 settings; linear + MLE, 200 Monte Carlo samples each) · ${report.workers} worker process(es) × ${report.concurrency} jobs`,
          `upload answered (202)          ${f(report.uploadS, 2)} s`,
          `all stored                     ${f(totalS)} s   (${f(report.runsPerS)} runs/s)   ${RUNS >= 1000 ? `target ≤ ${TARGET_S} s: ${report.met ? "met" : "NOT met"}` : `(the ${TARGET_S} s target is for 1,000 runs)`}`,
          `stored: ${check.runs} runs, ${check.mleWithSamples} MLE reconstructions with 200 samples; files ${JSON.stringify(batch.counts)}`,
          `web process while busy: /api/health p50 ${f(report.health.p50Ms)} ms, p99 ${f(report.health.p99Ms)} ms, max ${f(report.health.maxMs)} ms (${latencies.length} probes)`,
        ].join("\n") + "\n",
      );
    }
    process.exitCode = report.met ? 0 : 1;
  } finally {
    for (const c of children) c.kill("SIGTERM");
    await Promise.all(children.map((c) => new Promise((r) => (c.exitCode !== null ? r(null) : c.once("exit", r)))));
    if (!process.env.KEEP_BENCH_DB) await admin.query(`drop database if exists "${name}" with (force)`);
    await admin.end();
  }
}

/** A lab with a member, a source and a session (3 ns window), and the member's API token. */
async function prepare(databaseUrl: string) {
  const ds = createDataSource(databaseUrl, { poolSize: 2, applicationName: "rhomb-bench" });
  await ds.initialize();
  await ds.runMigrations({ transaction: "all" });
  setDataSource(ds);
  const user = await ds.getRepository(User).save({ email: "bench@larkspur.example", displayName: "Bench", passwordHash: "-", emailVerifiedAt: new Date() });
  const lab = await ds.getRepository(Lab).save({ name: "Benchmark lab", institution: "Larkspur Institute", createdById: user.id });
  await ds.getRepository(LabMembership).save({ labId: lab.id, userId: user.id, role: "member" });
  const source = await ds.getRepository(Source).save({ labId: lab.id, name: "Sagnac-2", createdById: user.id });
  const labSession = await ds.getRepository(LabSession).save({
    labId: lab.id, sourceId: source.id, title: "Benchmark sweep", date: "2026-03-02", coincidenceWindowNs: 3, analyser: { arms: [{ bothPorts: false }, { bothPorts: false }] },
    calibration: [{ qwp: { fastAxisOffsetDeg: 0, retardanceErrorDeg: 0 }, hwp: { fastAxisOffsetDeg: 0, retardanceErrorDeg: 0 } }, { qwp: { fastAxisOffsetDeg: 0, retardanceErrorDeg: 0 }, hwp: { fastAxisOffsetDeg: 0, retardanceErrorDeg: 0 } }],
    createdById: user.id,
  });
  const { secret } = await createApiToken({ id: user.id, email: user.email, displayName: user.displayName }, { name: "bench", labId: lab.id, expiresInDays: null });
  await ds.destroy();
  return { labId: lab.id, sessionId: labSession.id, secret };
}

function csvFor(i: number): string {
  const rows = simulateCounts({ rho: wernerLike(0.97), settings: standardSet("tomo16").labels, pairRate: 2000 + 10 * (i % 100), seconds: 1, seed: 7000 + i, singles: { rateA: 40_000, rateB: 40_000, windowNs: 3 } });
  return writeTomographyCsv(rows, [`Invented benchmark run ${i}`]);
}

function start(entry: string, env: Record<string, string>, readyUrl: string | null, nodeArgs: string[] = []): Promise<ChildProcess> {
  const child = spawn(process.execPath, [...nodeArgs, "--import", "tsx", entry], { env: { ...process.env, ...env }, stdio: ["ignore", "inherit", "inherit"] });
  return new Promise((resolve, reject) => {
    const deadline = Date.now() + 30_000;
    const tick = async () => {
      if (child.exitCode !== null) return reject(new Error(`${entry} exited with ${child.exitCode}`));
      if (!readyUrl) return setTimeout(() => resolve(child), 2500);
      const ok = await fetch(readyUrl).then((r) => r.ok, () => false);
      if (ok) return resolve(child);
      if (Date.now() > deadline) return reject(new Error(`${entry} did not start`));
      setTimeout(tick, 200);
    };
    void tick();
  });
}

function healthProbe(base: string) {
  const latencies: number[] = [];
  let running = true;
  const loop = (async () => {
    while (running) {
      const t = performance.now();
      await fetch(`${base}/api/health`).then((r) => r.arrayBuffer());
      latencies.push(performance.now() - t);
      await new Promise((r) => setTimeout(r, 100));
    }
  })();
  return { stop: async () => ((running = false), await loop, latencies) };
}

async function verify(databaseUrl: string, sessionId: string) {
  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  const { rows } = await client.query(
    `SELECT (SELECT count(*)::int FROM runs WHERE session_id = $1) AS runs,
            (SELECT count(*)::int FROM reconstructions r JOIN runs u ON u.id = r.run_id WHERE u.session_id = $1 AND r.method = 'mle' AND r.monte_carlo_samples = 200) AS "mleWithSamples"`,
    [sessionId],
  );
  await client.end();
  return rows[0] as { runs: number; mleWithSamples: number };
}

function pct(xs: number[], q: number): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.floor(q * s.length))] ?? NaN;
}

main().catch((err) => {
  console.error(`bench:batch failed: ${(err as Error).stack ?? err}`);
  process.exit(1);
});
