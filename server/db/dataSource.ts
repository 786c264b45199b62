import "reflect-metadata";
import { DataSource } from "typeorm";
import { entities } from "../entities/index";
import { migrations } from "./migrations/index";

/**
 * The one DataSource of the app. Schema changes go through migrations only; `synchronize` stays
 * off everywhere.
 */
export function createDataSource(url: string, options: { poolSize?: number; applicationName?: string } = {}): DataSource {
  return new DataSource({
    type: "postgres",
    url,
    entities,
    migrations,
    migrationsTableName: "schema_migrations",
    migrationsTransactionMode: "all",
    synchronize: false,
    logging: false,
    poolSize: options.poolSize ?? 10,
    applicationName: options.applicationName ?? "rhomb",
    extra: { connectionTimeoutMillis: 3000, idleTimeoutMillis: 30000 },
  });
}

let current: DataSource | undefined;

/** The process-wide DataSource, set once by whoever starts the process (server, worker, CLI, test). */
export function setDataSource(ds: DataSource): void {
  current = ds;
}

export function db(): DataSource {
  if (!current) throw new Error("DataSource not initialised: call setDataSource() at start-up");
  return current;
}
