import { execFile } from "node:child_process";
import { promisify } from "node:util";
import type { TestProject } from "vitest/node";
import { freePort, startRhombProcess } from "../../support/processes";
import { createTestDatabase } from "../../support/testDatabase";

declare module "vitest" {
  export interface ProvidedContext {
    baseUrl: string;
  }
}

const run = promisify(execFile);

/**
 * The real thing for browser tests: a fresh database on the test cluster, migrated and seeded
 * with the demo lab (`npm run seed`), the client built when its sources changed (the same check
 * `npm start` makes), and the real server on a free port serving both.
 */
export default async function setup(project: TestProject) {
  const db = await createTestDatabase("rhomb_e2e");
  const env = { ...process.env, DATABASE_URL: db.databaseUrl };
  try {
    await run("node_modules/.bin/tsx", ["server/db/seed.ts"], { env });
    await run("bash", ["-c", "source scripts/lib.sh && ensure_client_build"], { env });
    const port = await freePort();
    const server = await startRhombProcess("server/index.ts", { DATABASE_URL: db.databaseUrl, PORT: String(port), HOST: "127.0.0.1", RHOMB_STATIC_DIR: "dist/client" }, "Rhomb is listening");
    project.provide("baseUrl", `http://127.0.0.1:${port}`);
    return async () => {
      server.child.kill("SIGTERM");
      await server.exited;
      await db.drop();
    };
  } catch (err) {
    await db.drop();
    throw err;
  }
}
