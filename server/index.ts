import "reflect-metadata";
import { createApp } from "./app";
import { config } from "./config";
import { createDataSource, setDataSource } from "./db/dataSource";
import { logger } from "./logger";
import { jobQueue, stopJobQueue } from "./jobs/queue";
import { startBatchWorkers } from "./jobs/workers";
import { startMonteCarloPool } from "./services/monteCarlo";

/** Starts the web process: database, HTTP server, and a clean shutdown on SIGINT/SIGTERM. */
async function main(): Promise<void> {
  const cfg = config();
  const dataSource = createDataSource(cfg.DATABASE_URL, { applicationName: "rhomb-web" });
  await dataSource.initialize();
  setDataSource(dataSource);
  // The queue starts with the web process (it queues batch files); RHOMB_IN_PROCESS_WORKERS=0 leaves the jobs to `npm run worker`.
  await jobQueue();
  if (cfg.RHOMB_IN_PROCESS_WORKERS > 0) await startBatchWorkers(cfg.RHOMB_IN_PROCESS_WORKERS);
  // Monte Carlo threads start (and warm up) now rather than on the first uncertainty request.
  startMonteCarloPool().catch((err) => logger.error({ err }, "Monte Carlo worker threads did not start; they will be started on first use"));
  const app = createApp({ config: cfg, dataSource });
  const server = app.listen(cfg.PORT, cfg.HOST, () => {
    logger.info({ url: cfg.publicUrl }, "Rhomb is listening");
  });
  server.on("error", (err: NodeJS.ErrnoException) => {
    logger.fatal(err.code === "EADDRINUSE" ? `port ${cfg.PORT} on ${cfg.HOST} is already in use; set PORT to another port` : err.message);
    process.exit(1);
  });

  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    logger.info({ signal }, "shutting down");
    // Running jobs get 4 s to finish; unfinished ones go back to the queue for another worker.
    const jobsStopped = stopJobQueue(4000).catch((err) => logger.error({ err }, "job queue did not stop cleanly"));
    server.close(() => void jobsStopped.then(() => dataSource.destroy()).finally(() => process.exit(0)));
    setTimeout(() => process.exit(0), 5000).unref();
  };
  process.on("SIGINT", () => stop("SIGINT"));
  process.on("SIGTERM", () => stop("SIGTERM"));
}

main().catch((err) => {
  logger.fatal({ err }, "Rhomb failed to start");
  process.exit(1);
});
