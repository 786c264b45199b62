import { execFileSync } from "node:child_process";
import type { TestProject } from "vitest/node";
import pg from "pg";
import { createDataSource } from "../../server/db/dataSource";

declare module "vitest" {
  export interface ProvidedContext {
    databaseUrl: string;
  }
}

/**
 * Creates a fresh, migrated database for this test run on the private test cluster and drops it
 * afterwards. `npm test` starts the cluster; a bare `npx vitest` starts it too.
 */
export default async function setup(project: TestProject) {
  const adminUrl = process.env.RHOMB_TEST_ADMIN_URL ?? execFileSync("bash", ["scripts/pg.sh", "up", "test"], { encoding: "utf8" }).trim();
  const name = `rhomb_test_${process.pid}_${Date.now().toString(36)}`;
  const admin = new pg.Client({ connectionString: adminUrl });
  await admin.connect();
  await admin.query(`create database "${name}"`);
  await admin.end();
  const databaseUrl = adminUrl.replace(/\/postgres$/, `/${name}`);

  const ds = createDataSource(databaseUrl, { poolSize: 2 });
  await ds.initialize();
  await ds.runMigrations({ transaction: "all" });
  await ds.destroy();
  project.provide("databaseUrl", databaseUrl);

  return async () => {
    if (process.env.KEEP_TEST_DB) return;
    const client = new pg.Client({ connectionString: adminUrl });
    await client.connect();
    await client.query(`drop database if exists "${name}" with (force)`);
    await client.end();
  };
}
