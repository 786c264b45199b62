import "reflect-metadata";
import { constants, setPriority } from "node:os";
import { config } from "../config";
import { createDataSource, setDataSource } from "../db/dataSource";
import { logger } from "../logger";
import { stopJobQueue } from "./queue";
import { startBatchWorkers } from "./workers";

/**
 * `npm run worker`: a process that only runs queue jobs. Start as many as you like, on this
 * machine or others, against the same DATABASE_URL; each takes RHOMB_WORKER_CONCURRENCY jobs at
 * a time. SIGINT/SIGTERM stop it gracefully: no new jobs, running ones finish (or go back to the
 * queue for another worker), then it exits.
 */
async function main(): Promise<void> {
  // Batch work yields the CPU to the web process on the same machine: a lower scheduling
  // priority, set before any thread starts, so the Monte Carlo threads inherit it (Linux).
  setPriority(constants.priority.PRIORITY_BELOW_NORMAL);
  const cfg = config();
  const dataSource = createDataSource(cfg.DATABASE_URL, { applicationName: "rhomb-worker", poolSize: cfg.RHOMB_WORKER_CONCURRENCY * 2 + 2 });
  await dataSource.initialize();
  setDataSource(dataSource);
  await startBatchWorkers(cfg.RHOMB_WORKER_CONCURRENCY);
  logger.info({ pid: process.pid, concurrency: cfg.RHOMB_WORKER_CONCURRENCY }, "Rhomb worker is running");

  let stopping = false;
  const stop = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    logger.info({ signal }, "worker shutting down: finishing running jobs");
    setTimeout(() => process.exit(1), 30_000).unref();
    await stopJobQueue();
    await dataSource.destroy();
    process.exit(0);
  };
  process.on("SIGINT", () => void stop("SIGINT"));
  process.on("SIGTERM", () => void stop("SIGTERM"));
}

main().catch((err) => {
  logger.fatal({ err }, "Rhomb worker failed to start");
  process.exit(1);
});
