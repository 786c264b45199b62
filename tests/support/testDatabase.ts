import { execFileSync } from "node:child_process";
import pg from "pg";
import { createDataSource } from "../../server/db/dataSource";

export interface TestDatabase {
  databaseUrl: string;
  /** Drops the database (unless KEEP_TEST_DB is set). */
  drop: () => Promise<void>;
}

/**
 * A fresh, migrated database for one test run on the private test cluster. `npm test` starts the
 * cluster and passes its admin URL; a bare `npx vitest` starts it here.
 */
export async function createTestDatabase(prefix = "rhomb_test"): Promise<TestDatabase> {
  const adminUrl = process.env.RHOMB_TEST_ADMIN_URL ?? execFileSync("bash", ["scripts/pg.sh", "up", "test"], { encoding: "utf8" }).trim();
  const name = `${prefix}_${process.pid}_${Date.now().toString(36)}`;
  await adminQuery(adminUrl, `create database "${name}"`);
  const databaseUrl = adminUrl.replace(/\/postgres$/, `/${name}`);

  const ds = createDataSource(databaseUrl, { poolSize: 2 });
  await ds.initialize();
  await ds.runMigrations({ transaction: "all" });
  await ds.destroy();

  return {
    databaseUrl,
    drop: async () => {
      if (process.env.KEEP_TEST_DB) return;
      await adminQuery(adminUrl, `drop database if exists "${name}" with (force)`);
    },
  };
}

async function adminQuery(adminUrl: string, sql: string): Promise<void> {
  const admin = new pg.Client({ connectionString: adminUrl });
  await admin.connect();
  try {
    await admin.query(sql);
  } finally {
    await admin.end();
  }
}
