import type { BatchFileStatus } from "@shared/schemas/batches";
import type { FileIssue } from "@shared/formats/runJson";
import { db } from "../db/dataSource";
import type { Batch } from "../entities/Batch";
import type { BatchFile } from "../entities/BatchFile";

/**
 * Holds a transaction-level advisory lock on (lab, content SHA-256) while `work` runs on other
 * connections. The lock's transaction does nothing else; when it ends (or its connection dies
 * with a crashed worker) the lock is gone, so no crash can leave it held. A second attempt at
 * the same content waits at most `waitSeconds` for it and then fails (pg-boss retries later), so
 * a stuck first attempt cannot pile up waiting workers behind it.
 */
export async function withContentLock<T>(labId: string, sha256: string, waitSeconds: number, work: () => Promise<T>): Promise<T> {
  const runner = db().createQueryRunner();
  await runner.connect();
  try {
    await runner.startTransaction();
    try {
      await runner.query(`SET LOCAL lock_timeout = '${Math.max(1, Math.round(waitSeconds))}s'`);
      await runner.query("SELECT pg_advisory_xact_lock(hashtextextended($1, 0))", [`rhomb.batch-content:${labId}:${sha256}`]);
    } catch (e) {
      // The failed statement aborted the transaction: end it before the connection goes back to the pool.
      await runner.rollbackTransaction().catch(() => undefined);
      throw e;
    }
    try {
      return await work();
    } finally {
      await runner.commitTransaction().catch(() => runner.rollbackTransaction().catch(() => undefined));
    }
  } finally {
    await runner.release();
  }
}

/**
 * A run of this lab whose stored file has this content, if any. `ours` when it must be this
 * file's own earlier attempt — created after the file was first picked up, in its session, and
 * claimed by no other batch file — which crashed between storing the run and saying so.
 */
export async function claimedRunWithContent(file: BatchFile, batch: Batch): Promise<{ runId: string; runName: string; sessionTitle: string; ours: boolean } | null> {
  const [row] = await db().query(
    `SELECT r.id, r.name, s.title,
            NOT EXISTS (SELECT 1 FROM batch_files o WHERE o.run_id = r.id AND o.id <> $3)
              AND r.session_id = $4 AND r.created_at >= $5 AS ours
       FROM attachments a JOIN runs r ON r.id = a.run_id JOIN lab_sessions s ON s.id = r.session_id
      WHERE a.lab_id = $1 AND a.sha256 = $2
      ORDER BY r.created_at LIMIT 1`,
    [file.labId, file.sha256, file.id, batch.sessionId, file.startedAt],
  );
  return row ? { runId: row.id, runName: row.name, sessionTitle: row.title, ours: row.ours } : null;
}

type Outcome =
  | { status: Extract<BatchFileStatus, "stored">; runId: string; message?: string | null }
  | { status: Extract<BatchFileStatus, "duplicate">; duplicateOfRunId: string; message: string }
  | { status: Extract<BatchFileStatus, "failed">; issues: FileIssue[]; message: string };

/**
 * For a stored file: a note when its run's name was already taken in the session (both runs are
 * kept; only identical bytes count as the same run), else null.
 */
export async function nameClashNote(runId: string): Promise<string | null> {
  const [row] = await db().query(
    `SELECT r.name, count(o.id)::int AS others
       FROM runs r LEFT JOIN runs o ON o.session_id = r.session_id AND o.name = r.name AND o.id <> r.id
      WHERE r.id = $1 GROUP BY r.name`,
    [runId],
  );
  if (!row || row.others === 0) return null;
  return `stored, but the session already had ${row.others === 1 ? "a run" : `${row.others} runs`} named “${row.name}”: both are kept; tell them apart by their figures or notes, or rename one`;
}

/** Finishes a file that is still queued or processing (a finished file never changes again). */
export async function markFile(id: string, outcome: Outcome): Promise<void> {
  await db().query(
    `UPDATE batch_files SET status = $2, run_id = $3, duplicate_of_run_id = $4, message = $5, issues = $6::jsonb, finished_at = now()
      WHERE id = $1 AND status IN ('queued', 'processing')`,
    [
      id,
      outcome.status,
      outcome.status === "stored" ? outcome.runId : null,
      outcome.status === "duplicate" ? outcome.duplicateOfRunId : null,
      outcome.status === "stored" ? (outcome.message ?? null) : outcome.message,
      JSON.stringify(outcome.status === "failed" ? outcome.issues : []),
    ],
  );
}
