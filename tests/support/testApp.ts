import "reflect-metadata";
import type { Express } from "express";
import type { DataSource } from "typeorm";
import { createApp } from "../../server/app";
import { loadConfig } from "../../server/config";
import { createDataSource, setDataSource } from "../../server/db/dataSource";

export interface TestApp {
  app: Express;
  dataSource: DataSource;
  close: () => Promise<void>;
}

/** The real app against this run's real database (never a mock). */
export async function startTestApp(): Promise<TestApp> {
  const config = loadConfig();
  const dataSource = createDataSource(config.DATABASE_URL, { poolSize: 5 });
  await dataSource.initialize();
  setDataSource(dataSource);
  const app = createApp({ config, dataSource });
  return { app, dataSource, close: () => dataSource.destroy() };
}
