import { LIMITS } from "@shared/limits";
import { BATCH_FILE_STATUSES, FINAL_STATUSES, type BatchCounts, type BatchFileStatus } from "@shared/schemas/batches";
import { db } from "../db/dataSource";
import { Batch } from "../entities/Batch";
import { BatchFile } from "../entities/BatchFile";
import type { AuthUser } from "../http/auth";
import { notFound, payloadTooLarge } from "../http/errors";
import { enqueueBatchFiles } from "../jobs/queue";
import { intake, type IntakeEntry, type UploadedPart } from "./batchIntake";
import { findLabSession } from "./labSessions";

export interface BatchView {
  batch: Batch;
  counts: BatchCounts;
  finishedAt: Date | null;
}

/** Rows per INSERT: well under PostgreSQL's 65,535 parameters with bytea content. */
const INSERT_CHUNK = 500;

/**
 * Records a batch: every entry of the upload becomes a batch file, and each readable one gets a
 * queued job — files and jobs in one transaction. Returns at once; the jobs do the work.
 */
export async function createBatch(user: AuthUser, labId: string, sessionId: string, files: UploadedPart[], options: { startAfterSeconds?: number } = {}): Promise<{ batch: Batch; files: BatchFile[] }> {
  const labSession = await findLabSession(labId, sessionId);
  const entries = intake(files);
  if (entries.length === 0) throw payloadTooLarge("The upload holds no files. Add run files (.csv, .json) or a .zip of them in the form field “files”.");
  if (entries.length > LIMITS.batchFiles) {
    throw payloadTooLarge(`One batch takes at most ${LIMITS.batchFiles.toLocaleString("en")} run files; this upload holds ${entries.length.toLocaleString("en")} (zip members and sweep rows count one each). Nothing was stored — split it into several batches.`);
  }
  return db().transaction(async (em) => {
    const batch = await em.save(
      em.create(Batch, { labId, sessionId: labSession.id, origin: user.token ? "token" : "browser", tokenId: user.token?.id ?? null, fileCount: entries.length, createdById: user.id }),
    );
    const rows = entries.map((e, position) => batchFileRow(batch, e, position));
    const saved: BatchFile[] = [];
    for (let i = 0; i < rows.length; i += INSERT_CHUNK) {
      const chunk = rows.slice(i, i + INSERT_CHUNK);
      const result = await em.insert(BatchFile, chunk);
      chunk.forEach((row, k) => saved.push({ ...row, id: result.identifiers[k].id } as BatchFile));
    }
    await enqueueBatchFiles(em, saved.filter((f) => f.status === "queued").map((f) => f.id), options);
    return { batch, files: saved };
  });
}

function batchFileRow(batch: Batch, e: IntakeEntry, position: number): Partial<BatchFile> {
  const refused = e.refusal !== null;
  return {
    labId: batch.labId,
    batchId: batch.id,
    position,
    fileName: e.fileName,
    format: e.format,
    sourceLine: e.sourceLine,
    sizeBytes: e.sizeBytes,
    sha256: e.sha256,
    content: e.content,
    status: refused ? "failed" : "queued",
    message: refused ? `${e.fileName}: ${e.refusal}` : null,
    issues: refused ? [{ row: null, column: null, message: e.refusal! }] : [],
    attempts: 0,
    finishedAt: refused ? new Date() : null,
  };
}

/** A batch of this lab with its files (no content) and the runs they became, or 404. */
export async function getBatch(labId: string, batchId: string): Promise<BatchView & { files: BatchFile[] }> {
  const batch = await db().getRepository(Batch).findOne({ where: { id: batchId, labId }, relations: { session: true, createdBy: true } });
  if (!batch) throw notFound("Batch");
  const files = await db().getRepository(BatchFile).find({ where: { batchId }, relations: { run: true, duplicateOf: true }, order: { position: "ASC" } });
  // Counts from the very rows returned, not a second query: a file finishing in between would
  // otherwise make the batch "done" while one of its files still says "processing".
  const tally = BATCH_FILE_STATUSES.map((status) => {
    const mine = files.filter((f) => f.status === status);
    return { status, n: mine.length, finished: latest(mine.map((f) => f.finishedAt)) };
  });
  return { ...summarise(batch, tally), files };
}

/** The lab's recent batches, newest first (optionally of one session). */
export async function listBatches(labId: string, sessionId?: string): Promise<BatchView[]> {
  const batches = await db().getRepository(Batch).find({ where: { labId, ...(sessionId && { sessionId }) }, relations: { session: true, createdBy: true }, order: { createdAt: "DESC" }, take: 50 });
  return withCounts(batches);
}

async function withCounts(batches: Batch[]): Promise<BatchView[]> {
  if (batches.length === 0) return [];
  const rows: Array<{ batch_id: string; status: BatchFileStatus; n: string; finished: Date | null }> = await db().query(
    `SELECT batch_id, status, count(*) AS n, max(finished_at) AS finished FROM batch_files WHERE batch_id = ANY($1) GROUP BY batch_id, status`,
    [batches.map((b) => b.id)],
  );
  return batches.map((batch) => summarise(batch, rows.filter((r) => r.batch_id === batch.id).map((r) => ({ ...r, n: Number(r.n) }))));
}

function latest(dates: Array<Date | null>): Date | null {
  const known = dates.filter((d): d is Date => !!d);
  return known.length ? new Date(Math.max(...known.map((d) => d.getTime()))) : null;
}

/** Counts per status (and when the last file finished, once all have) from a tally of the files. */
function summarise(batch: Batch, tally: Array<{ status: BatchFileStatus; n: number; finished: Date | null }>): BatchView {
  const counts = Object.fromEntries(BATCH_FILE_STATUSES.map((s) => [s, tally.find((r) => r.status === s)?.n ?? 0])) as BatchCounts;
  const done = BATCH_FILE_STATUSES.every((s) => FINAL_STATUSES.includes(s) || counts[s] === 0);
  return { batch, counts, finishedAt: done ? latest(tally.map((r) => r.finished)) : null };
}
