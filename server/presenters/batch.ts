import type { BatchDto, BatchFileDto, BatchSummaryDto } from "@shared/schemas/batches";
import type { BatchFile } from "../entities/BatchFile";
import type { BatchView } from "../services/batches";
import { presentPerson } from "./person";

export function presentBatchSummary({ batch, counts, finishedAt }: BatchView): BatchSummaryDto {
  return {
    id: batch.id,
    labId: batch.labId,
    session: { id: batch.sessionId, title: batch.session?.title ?? "" },
    origin: batch.origin,
    fileCount: batch.fileCount,
    counts,
    // Every finished file has a finish time, so the batch is done exactly when it has one.
    done: finishedAt !== null,
    createdBy: presentPerson(batch.createdBy),
    createdAt: batch.createdAt.toISOString(),
    finishedAt: finishedAt?.toISOString() ?? null,
  };
}

export function presentBatchFile(f: BatchFile): BatchFileDto {
  return {
    id: f.id,
    position: f.position,
    fileName: f.fileName,
    format: f.format,
    sizeBytes: f.sizeBytes,
    status: f.status,
    message: f.message,
    issues: f.issues,
    run: f.run ? { id: f.run.id, name: f.run.name } : null,
    duplicateOf: f.duplicateOf ? { id: f.duplicateOf.id, name: f.duplicateOf.name } : null,
    attempts: f.attempts,
  };
}

export function presentBatch(view: BatchView & { files: BatchFile[] }): BatchDto {
  return { ...presentBatchSummary(view), files: view.files.map(presentBatchFile) };
}
