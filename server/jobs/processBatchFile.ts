import { describeIssue, RunFileError, type FileIssue } from "@shared/formats/runJson";
import { config } from "../config";
import { db } from "../db/dataSource";
import { Batch } from "../entities/Batch";
import { BatchFile } from "../entities/BatchFile";
import { User } from "../entities/User";
import type { AuthUser } from "../http/auth";
import { HttpError } from "../http/errors";
import { toHttpError } from "../http/errorMiddleware";
import { logger } from "../logger";
import { runPolicy } from "../policies/runs";
import { createRun } from "../services/runs";
import { uploadRun } from "../services/uploads";
import { baseName, issuesOf, parseRunContent, stem } from "./batchFileContent";
import { claimedRunWithContent, markFile, nameClashNote, withContentLock } from "./batchFileState";

/**
 * One job: store one batch file as a run (with its reconstructions and the file's bytes, in the
 * notebook's one transaction) or say precisely why not.
 *
 * Exactly once, even when a worker dies mid-job and pg-boss runs the job again, or two copies of
 * the same content are processed at the same moment: everything from "is this content stored
 * already?" to "mark the file stored" happens under a PostgreSQL advisory lock on (lab, SHA-256),
 * and the run's attachment — written in the same transaction as the run — is the record that
 * the content is stored. A retry that finds the attachment of its own earlier attempt adopts
 * that run instead of storing a second one.
 */
export async function processBatchFile(batchFileId: string, options: { finalAttempt: boolean }): Promise<void> {
  const file = await claim(batchFileId);
  if (!file) return;
  try {
    await withContentLock(file.labId, file.sha256!, config().RHOMB_JOB_TIMEOUT_SECONDS / 2, async () => {
      const current = await db().getRepository(BatchFile).findOneByOrFail({ id: file.id });
      if (current.status !== "processing") return;
      const batch = await db().getRepository(Batch).findOneByOrFail({ id: file.batchId });
      const existing = await claimedRunWithContent(file, batch);
      if (existing) {
        await (existing.ours ? markFile(file.id, { status: "stored", runId: existing.runId }) : markFile(file.id, { status: "duplicate", duplicateOfRunId: existing.runId, message: `${file.fileName}: already stored as run “${existing.runName}” in session “${existing.sessionTitle}” — not stored again` }));
        return;
      }
      const user = await uploader(batch);
      await runPolicy.create(user, file.labId);
      const runId = await store(user, batch, file);
      await markFile(file.id, { status: "stored", runId, message: await nameClashNote(runId) });
    });
  } catch (e) {
    const issues = fileIssues(e, file);
    if (issues) return markFailed(file, issues);
    if (isTransient(e) && !options.finalAttempt) throw e;
    logger.error({ err: e, batchFileId, attempts: file.attempts }, "batch file failed");
    const why = isTransient(e) ? `could not be processed after ${file.attempts} attempts` : "could not be reconstructed because of an internal error (logged on the server)";
    return markFailed(file, [{ row: null, column: null, message: `${why}: ${(e as Error).message}. Nothing was stored — upload it again later.` }]);
  }
}

/**
 * Failures worth another attempt: the database away or busy (a lock wait that timed out, a
 * deadlock). Anything else — an engine error, a bug — would fail the same way again, so the file
 * fails at once instead of costing four more reconstructions. (A worker that dies mid-job needs
 * no rule here: pg-boss retries its job after the job timeout.)
 */
const TRANSIENT_CODES = new Set(["55P03", "40P01", "40001"]);
function isTransient(e: unknown): boolean {
  const code = (e as { code?: string; driverError?: { code?: string } })?.driverError?.code ?? (e as { code?: string })?.code;
  return (code !== undefined && TRANSIENT_CODES.has(code)) || toHttpError(e).status === 503;
}

/** Marks the file as being processed (one more attempt); null when it is already finished. */
async function claim(id: string): Promise<(BatchFile & { content: Buffer }) | null> {
  const [updated] = await db().query(
    `WITH claimed AS (
       UPDATE batch_files SET status = 'processing', attempts = attempts + 1, started_at = coalesce(started_at, now())
        WHERE id = $1 AND status IN ('queued', 'processing') AND format IS NOT NULL RETURNING id)
     SELECT id FROM claimed`,
    [id],
  );
  if (!updated) return null;
  return db().getRepository(BatchFile).createQueryBuilder("f").addSelect("f.content").where("f.id = :id", { id }).getOneOrFail() as Promise<BatchFile & { content: Buffer }>;
}

async function uploader(batch: Batch): Promise<AuthUser> {
  const user = batch.createdById ? await db().getRepository(User).findOneBy({ id: batch.createdById }) : null;
  if (!user) throw new HttpError(409, "uploader_gone", "the account that uploaded this batch no longer exists");
  return { id: user.id, email: user.email, displayName: user.displayName, ...(batch.tokenId && { token: { id: batch.tokenId, labId: batch.labId } }) };
}

async function store(user: AuthUser, batch: Batch, file: BatchFile & { content: Buffer }): Promise<string> {
  const name = baseName(file.fileName);
  if (file.format === "run-csv") {
    return (await uploadRun(user, batch.labId, batch.sessionId, { originalname: name, mimetype: "text/csv", buffer: file.content }, {})).run.id;
  }
  const run = parseRunContent(file.format!, file.content, file.fileName, file.sourceLine);
  const stored = file.format === "sweep-line" ? { fileName: `${stem(name)} row ${file.sourceLine}.csv`, contentType: "text/csv" } : { fileName: name, contentType: "application/json" };
  return (await createRun(user, batch.labId, batch.sessionId, run, { ...stored, content: file.content, sha256: file.sha256! })).run.id;
}

/** Problems with the file itself (or its uploader's rights): these fail at once, without retries. */
function fileIssues(e: unknown, file: BatchFile & { content: Buffer }): FileIssue[] | null {
  if (e instanceof RunFileError) return e.issues;
  if (e instanceof HttpError && e.status < 500) {
    if (e.status === 403 || e.status === 404) return [{ row: null, column: null, message: `not stored: the uploader may no longer add runs to this session (${e.message})` }];
    return issuesOf(e, file.format!, file.content, file.sourceLine);
  }
  return null;
}

async function markFailed(file: BatchFile, issues: FileIssue[]): Promise<void> {
  const described = issues.map((i) => describeIssue(i.row !== null && i.row === file.sourceLine ? { ...i, row: null } : i));
  await markFile(file.id, { status: "failed", issues, message: `${file.fileName}: ${described.join("; ")}` });
}
