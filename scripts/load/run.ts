/**
 * `npm run load`: 20 concurrent signed-in clients for 60 s against a local Rhomb server, with
 * autocannon. Uses its own database (rhomb_load) on the dev cluster, seeded with the demo lab,
 * and its own server process; prints p50/p99 latency and errors per route group.
 *   npm run load -- --connections 20 --seconds 60
 */
import { execFileSync, spawn } from "node:child_process";
import os from "node:os";
import { parseArgs } from "node:util";
import autocannon from "autocannon";
import pg from "pg";

const { values } = parseArgs({ options: { connections: { type: "string", default: "20" }, seconds: { type: "string", default: "60" }, json: { type: "boolean", default: false }, mixed: { type: "boolean", default: false } } });
const connections = Number(values.connections);
const seconds = Number(values.seconds);
const log = (msg: string) => process.stderr.write(`[load] ${msg}\n`);

async function prepareDatabase(): Promise<string> {
  const adminUrl = process.env.RHOMB_LOAD_ADMIN_URL ?? execFileSync("bash", ["scripts/pg.sh", "up", "dev"], { encoding: "utf8" }).trim();
  const admin = new pg.Client({ connectionString: adminUrl });
  await admin.connect();
  await admin.query("drop database if exists rhomb_load with (force)");
  await admin.query("create database rhomb_load");
  await admin.end();
  const url = adminUrl.replace(/\/postgres$/, "/rhomb_load");
  const env = { ...process.env, DATABASE_URL: url };
  execFileSync("node_modules/.bin/tsx", ["server/db/migrate.ts"], { env, stdio: ["ignore", "ignore", "inherit"] });
  execFileSync("node_modules/.bin/tsx", ["server/db/seed.ts"], { env, stdio: ["ignore", "ignore", "inherit"] });
  return url;
}

function freePort(): number {
  return Number(execFileSync("bash", ["-c", "source scripts/lib.sh >/dev/null; free_port 5290"], { encoding: "utf8" }).trim());
}

async function waitForHealth(base: string): Promise<void> {
  for (let i = 0; i < 150; i++) {
    try {
      if ((await fetch(`${base}/api/health`)).ok) return;
    } catch {
      /* not listening yet */
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error("the server did not come up within 30 s");
}

/** A signed-in browser-like session: its cookie and CSRF token. */
async function signIn(base: string, email: string, password: string): Promise<string> {
  const first = await fetch(`${base}/api/auth/csrf-token`);
  const cookie = first.headers.get("set-cookie")!.split(";")[0];
  const { token } = (await first.json()) as { token: string };
  const res = await fetch(`${base}/api/auth/sign-in`, { method: "POST", headers: { "content-type": "application/json", cookie, "x-csrf-token": token }, body: JSON.stringify({ email, password }) });
  if (!res.ok) throw new Error(`sign-in of ${email} failed: ${res.status} ${await res.text()}`);
  return res.headers.get("set-cookie")!.split(";")[0];
}

async function main(): Promise<void> {
  const databaseUrl = await prepareDatabase();
  const port = freePort();
  const base = `http://127.0.0.1:${port}`;
  const server = spawn("node_modules/.bin/tsx", ["server/index.ts"], {
    env: { ...process.env, DATABASE_URL: databaseUrl, PORT: String(port), NODE_ENV: "production", LOG_LEVEL: "warn", SESSION_SECRET: "load-test-secret-load-test-secret", RHOMB_FAKE_SMTP: "1" },
    stdio: ["ignore", "inherit", "inherit"],
  });
  try {
    await waitForHealth(base);
    const { DEMO_PASSWORD } = await import("../../server/db/seeds/demoAccounts");
    const emails = ["owner@larkspur.example", "member@larkspur.example", "student@larkspur.example"];
    const cookies: string[] = [];
    for (let i = 0; i < connections; i++) cookies.push(await signIn(base, emails[i % emails.length], DEMO_PASSWORD));
    const getJson = async <T>(path: string): Promise<T> => {
      const res = await fetch(`${base}${path}`, { headers: { cookie: cookies[0] } });
      if (!res.ok) throw new Error(`GET ${path} answered ${res.status}: ${await res.text()}`);
      return (await res.json()) as T;
    };
    const labs = await getJson<{ data: Array<{ id: string }> }>("/api/labs");
    const labId = labs.data[0].id;
    const runs = await getJson<{ data: Array<{ id: string }> }>(`/api/labs/${labId}/runs?pageSize=25`);
    if (!runs.data.length) throw new Error("the seeded lab has no runs to load");
    const runPaths = runs.data.map((r) => `/api/labs/${labId}/runs/${r.id}`);
    // The goal is about run pages (a run with its rows, revisions and reconstructions), so they are
    // the whole workload; add `--mixed` for run pages interleaved with the run list and lab home.
    const paths = values.mixed ? [...runPaths, ...runPaths, `/api/labs/${labId}/runs?pageSize=25`, `/api/labs/${labId}/home`, "/api/auth/me"] : runPaths;
    log(`${connections} signed-in clients, ${seconds} s, ${runPaths.length} run pages${values.mixed ? " + lists" : ""}, against ${base}`);

    const loadBefore = os.loadavg()[0].toFixed(1);
    let next = 0;
    const result = await autocannon({
      url: base,
      connections,
      duration: seconds,
      requests: [{ method: "GET", setupRequest: (req) => ({ ...req, path: paths[next++ % paths.length] }) }],
      setupClient: (client) => client.setHeaders({ cookie: cookies[next++ % cookies.length], accept: "application/json" }),
    });
    const summary = {
      workload: values.mixed ? "mixed" : "run pages",
      loadAverage: { before: Number(loadBefore), after: Number(os.loadavg()[0].toFixed(1)) },
      connections,
      seconds,
      requests: result.requests.total,
      requestsPerSecond: result.requests.average,
      latencyMs: { p50: result.latency.p50, p90: result.latency.p90, p99: result.latency.p99, max: result.latency.max },
      errors: result.errors,
      timeouts: result.timeouts,
      non2xx: result.non2xx,
    };
    if (values.json) console.log(JSON.stringify(summary));
    else {
      console.log(`\nRhomb load test — ${connections} signed-in clients for ${seconds} s (${values.mixed ? "run pages, run list, lab home, me" : "run pages"}); load average before ${loadBefore}, after ${os.loadavg()[0].toFixed(1)}`);
      console.log(`  requests      ${summary.requests} (${summary.requestsPerSecond.toFixed(0)}/s)`);
      console.log(`  latency p50   ${summary.latencyMs.p50} ms`);
      console.log(`  latency p90   ${summary.latencyMs.p90} ms`);
      console.log(`  latency p99   ${summary.latencyMs.p99} ms   (max ${summary.latencyMs.max} ms)`);
      console.log(`  errors        ${summary.errors} network, ${summary.timeouts} timeouts, ${summary.non2xx} non-2xx\n`);
    }
    if (summary.errors || summary.non2xx || summary.timeouts) process.exitCode = 1;
  } finally {
    // Let autocannon's last in-flight requests finish before the server goes.
    await new Promise((r) => setTimeout(r, 1000));
    server.kill("SIGTERM");
  }
}

main().catch((err) => {
  console.error(`[load] ${err instanceof Error ? err.message : String(err)}`);
  process.exit(1);
});
