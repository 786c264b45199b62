import type PgBoss from "pg-boss";
import { logger } from "../logger";
import { processBatchFile } from "./processBatchFile";
import { BATCH_FILE_QUEUE, jobQueue, type BatchFileJobData } from "./queue";

/** Seconds between polls of an idle queue (pg-boss's minimum is 0.5 s). */
const IDLE_POLL_SECONDS = 1;

/**
 * Starts `count` queue workers in this process, each taking one batch file at a time. A worker
 * that finds a job polls again at once, so a busy queue runs back to back; heavy numbers go to
 * the Monte Carlo worker threads, so the event loop stays free meanwhile.
 *
 * pg-boss 10 waits out the rest of the polling interval after every fetch, even one that found
 * a job (src/worker.js), which capped each worker at one file per second; notifying the worker
 * from its own handler skips that wait, so only an empty queue is polled at the interval.
 */
export async function startBatchWorkers(count: number): Promise<PgBoss> {
  const boss = await jobQueue();
  for (let i = 0; i < count; i++) {
    const workerId: string = await boss.work<BatchFileJobData>(BATCH_FILE_QUEUE, { batchSize: 1, pollingIntervalSeconds: IDLE_POLL_SECONDS, includeMetadata: true }, async ([job]) => {
      await processBatchFile(job.data.batchFileId, { finalAttempt: job.retryCount >= job.retryLimit });
      // pg-boss completes a job after its handler without waiting for that write; a worker that
      // stops right then would leave the job to expire and run again (harmlessly, but later).
      // Completing it here first makes the record durable; pg-boss's own completion is then a no-op.
      await boss.complete(BATCH_FILE_QUEUE, job.id);
      boss.notifyWorker(workerId);
    });
  }
  logger.info({ queue: BATCH_FILE_QUEUE, workers: count }, "batch workers started");
  return boss;
}
