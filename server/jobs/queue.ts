import PgBoss from "pg-boss";
import type { EntityManager } from "typeorm";
import { config } from "../config";
import { logger } from "../logger";

/**
 * The job queue: pg-boss 10 in the application's own PostgreSQL (schema "pgboss", created and
 * migrated by pg-boss when it starts). Every process — the web server, `npm run worker` on this
 * or another machine — opens its own instance against the same DATABASE_URL; PostgreSQL's
 * SKIP LOCKED hands each job to exactly one of them at a time.
 */
export const BATCH_FILE_QUEUE = "batch-file";

export interface BatchFileJobData {
  batchFileId: string;
}

/** Retries cover crashes and a database that is briefly away; bad files fail at once instead. */
const RETRY = { retryLimit: 4, retryDelay: 2, retryBackoff: true } as const;

let started: Promise<PgBoss> | undefined;

/** This process's queue, started on first use (and the queues created: `send` to a missing one returns null silently). */
export function jobQueue(): Promise<PgBoss> {
  started ??= startQueue().catch((err) => {
    started = undefined;
    throw err;
  });
  return started;
}

async function startQueue(): Promise<PgBoss> {
  const cfg = config();
  const timeout = cfg.RHOMB_JOB_TIMEOUT_SECONDS;
  const boss = new PgBoss({
    connectionString: cfg.DATABASE_URL,
    application_name: "rhomb-queue",
    schema: "pgboss",
    max: 4,
    // Lost jobs (a worker killed mid-job) are found by maintenance; look often enough that a
    // lost job is retried soon after its timeout.
    maintenanceIntervalSeconds: Math.max(1, Math.min(60, Math.floor(timeout / 2))),
  });
  boss.on("error", (err) => logger.error({ err }, "job queue error"));
  await boss.start();
  await boss.createQueue(BATCH_FILE_QUEUE, { name: BATCH_FILE_QUEUE, ...RETRY, expireInSeconds: timeout });
  return boss;
}

/**
 * Queues one job per batch file inside the caller's transaction, so the files and their jobs
 * are stored together or not at all (a crash between the two would otherwise strand files as
 * "queued" forever). The job id is the file id, which makes a repeated insert harmless.
 */
export async function enqueueBatchFiles(em: EntityManager, batchFileIds: string[], options: { startAfterSeconds?: number } = {}): Promise<void> {
  if (batchFileIds.length === 0) return;
  const boss = await jobQueue();
  const expireInSeconds = config().RHOMB_JOB_TIMEOUT_SECONDS;
  const startAfter = options.startAfterSeconds ? new Date(Date.now() + options.startAfterSeconds * 1000) : undefined;
  const jobs = batchFileIds.map((id) => ({ id, name: BATCH_FILE_QUEUE, data: { batchFileId: id } satisfies BatchFileJobData, expireInSeconds, ...RETRY, ...(startAfter && { startAfter }) }));
  await boss.insert(jobs, { db: { executeSql: async (text: string, values: unknown[]) => ({ rows: await em.query(text, values) }) } });
}

/** Stops fetching, lets running jobs finish (up to `timeoutMs`), then hands unfinished ones back for a retry. */
export async function stopJobQueue(timeoutMs = 20_000): Promise<void> {
  const boss = started;
  started = undefined;
  if (!boss) return;
  await (await boss.catch(() => null))?.stop({ graceful: true, wait: true, timeout: timeoutMs });
}
