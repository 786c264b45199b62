import "reflect-metadata";
import { createApp } from "./app";
import { config } from "./config";
import { createDataSource, setDataSource } from "./db/dataSource";
import { logger } from "./logger";

/** Starts the web process: database, HTTP server, and a clean shutdown on SIGINT/SIGTERM. */
async function main(): Promise<void> {
  const cfg = config();
  const dataSource = createDataSource(cfg.DATABASE_URL, { applicationName: "rhomb-web" });
  await dataSource.initialize();
  setDataSource(dataSource);
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
    server.close(() => void dataSource.destroy().finally(() => process.exit(0)));
    setTimeout(() => process.exit(0), 5000).unref();
  };
  process.on("SIGINT", () => stop("SIGINT"));
  process.on("SIGTERM", () => stop("SIGTERM"));
}

main().catch((err) => {
  logger.fatal({ err }, "Rhomb failed to start");
  process.exit(1);
});
