import "reflect-metadata";
import { createDataSource } from "./dataSource";
import { loadConfig } from "../config";
import { seedDemoAccounts } from "./seeds/demoAccounts";
import { seedDemoNotebook } from "./seeds/demoNotebook";
import { seedDemoBellFringe } from "./seeds/demoBellFringe";
import { seedDemoShares } from "./seeds/demoShares";

/**
 * `npm run seed`: the invented demo lab (see README "Demo data"). Idempotent — running it again
 * adds only what is missing; it runs in one transaction.
 */
async function main(): Promise<void> {
  const ds = createDataSource(loadConfig().DATABASE_URL, { poolSize: 2, applicationName: "rhomb-seed" });
  await ds.initialize();
  try {
    await ds.transaction(async (em) => {
      const { lab, users } = await seedDemoAccounts(em);
      await seedDemoNotebook(em, lab, users);
      await seedDemoBellFringe(em, lab, users);
      await seedDemoShares(em);
    });
    console.log("[rhomb] demo data is in place");
  } finally {
    await ds.destroy();
  }
}

main().catch((err) => {
  console.error(`[rhomb] seeding failed: ${err instanceof Error ? err.message : String(err)}`);
  process.exit(1);
});
