import { createDataSource } from "./dataSource";
import { loadConfig } from "../config";

/** `npm run migrate`: applies pending migrations in one transaction. */
async function main(): Promise<void> {
  const ds = createDataSource(loadConfig().DATABASE_URL, { poolSize: 2, applicationName: "rhomb-migrate" });
  await ds.initialize();
  try {
    const ran = await ds.runMigrations({ transaction: "all" });
    console.log(ran.length ? `[rhomb] applied ${ran.length} migration(s): ${ran.map((m) => m.name).join(", ")}` : "[rhomb] database schema is up to date");
  } finally {
    await ds.destroy();
  }
}

main().catch((err) => {
  console.error(`[rhomb] migration failed: ${err instanceof Error ? err.message : String(err)}`);
  process.exit(1);
});
