import { execFileSync } from "node:child_process";
import fs from "node:fs";
import pg from "pg";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createApp } from "../../server/app";
import { loadConfig } from "../../server/config";
import { createDataSource, setDataSource } from "../../server/db/dataSource";
import { Lab } from "../../server/entities/Lab";
import { createUser, signedInClient } from "../support/clients";
import type { TestApp } from "../support/testApp";

/**
 * Database outages and server restarts, on a private cluster of this test's own (stopping the
 * shared test cluster would break other suites).
 */
const clusterName = `faults-${process.pid}`;
const pgsh = (cmd: string) => execFileSync("bash", ["scripts/pg.sh", cmd, clusterName], { encoding: "utf8" }).trim();

async function startAppOn(databaseUrl: string): Promise<TestApp> {
  const config = { ...loadConfig(), DATABASE_URL: databaseUrl };
  const dataSource = createDataSource(databaseUrl, { poolSize: 4 });
  await dataSource.initialize();
  setDataSource(dataSource);
  return { app: createApp({ config, dataSource }), dataSource, close: () => dataSource.destroy() };
}

describe("faults: the database goes away and comes back; the server restarts", () => {
  let databaseUrl: string;
  let t: TestApp;

  beforeAll(async () => {
    const adminUrl = pgsh("up");
    const admin = new pg.Client({ connectionString: adminUrl });
    await admin.connect();
    await admin.query("create database rhomb_faults");
    await admin.end();
    databaseUrl = adminUrl.replace(/\/postgres$/, "/rhomb_faults");
    const ds = createDataSource(databaseUrl, { poolSize: 1 });
    await ds.initialize();
    await ds.runMigrations({ transaction: "all" });
    await ds.destroy();
    t = await startAppOn(databaseUrl);
  }, 120_000);

  afterAll(async () => {
    await t?.close().catch(() => undefined);
    pgsh("down");
    fs.rmSync(pgsh("dir"), { recursive: true, force: true });
  });

  it("answers 503 with a clear message while PostgreSQL is down, writes nothing, and recovers by itself", async () => {
    const user = await createUser(t, "Fault tester");
    const client = await signedInClient(t, user);
    await client.get("/api/labs").expect(200);

    pgsh("down");
    const health = await request(t.app).get("/api/health");
    expect(health.status).toBe(503);
    expect(health.body.database.status).toBe("down");
    const list = await client.get("/api/labs");
    expect(list.status).toBe(503);
    expect(list.body.error.code).toBe("service_unavailable");
    expect(list.body.error.message).toMatch(/database is not reachable/);
    const write = await client.post("/api/labs", { name: "Written during the outage" });
    expect(write.status).toBe(503);

    pgsh("up");
    let recovered = 0;
    for (let i = 0; i < 50 && recovered !== 200; i++) {
      recovered = (await request(t.app).get("/api/health")).status;
      if (recovered !== 200) await new Promise((r) => setTimeout(r, 200));
    }
    expect(recovered).toBe(200);
    await client.get("/api/labs").expect(200);
    const written = await t.dataSource.getRepository(Lab).countBy({ name: "Written during the outage" });
    expect(written).toBe(0);
  }, 60_000);

  it("keeps sign-ins across a server restart (sessions live in PostgreSQL)", async () => {
    const user = await createUser(t, "Restart tester");
    const client = await signedInClient(t, user);
    const cookie = (await client.get("/api/auth/me").expect(200)).request.cookies;
    await t.close();
    t = await startAppOn(databaseUrl);
    const me = await request(t.app).get("/api/auth/me").set("Cookie", cookie).expect(200);
    expect(me.body.email).toBe(user.email);
  }, 60_000);
});
