import { z } from "zod";
import { UuidSchema, PersonRefSchema } from "./listing";
import { RunDetailSchema } from "./runs";

/**
 * Batch uploads: many run files at once (CSV, JSON, sweep CSV, or zips of them) into one lab
 * session. Each file — each line of a sweep file, each member of a zip — becomes one BatchFile
 * with its own status, processed by the job queue.
 */
export const BATCH_FILE_STATUSES = ["queued", "processing", "stored", "failed", "duplicate"] as const;
export const BatchFileStatusSchema = z.enum(BATCH_FILE_STATUSES);
export type BatchFileStatus = z.infer<typeof BatchFileStatusSchema>;
/** Statuses a file never leaves. */
export const FINAL_STATUSES: readonly BatchFileStatus[] = ["stored", "failed", "duplicate"];

/** How a file was read: our one-run CSV, one-run JSON, or one line of a sweep CSV. */
export const BatchFileFormatSchema = z.enum(["run-csv", "run-json", "sweep-line"]);
export type BatchFileFormat = z.infer<typeof BatchFileFormatSchema>;

export const BatchIdParamsSchema = z.object({ labId: UuidSchema("Lab id"), batchId: UuidSchema("Batch id") });

/**
 * The multipart body of a batch upload into POST /labs/:labId/sessions/:sessionId/batches: one
 * or more run files under any field name (our client and CLI use "files"). Runs get the
 * reconstructions of any saved run (linear and maximum likelihood, 200 Monte Carlo samples); a
 * one-run JSON file may choose its own ("reconstruction").
 */
export const BatchUploadSchema = z.object({
  files: z.unknown().optional().describe("Run files: one-run CSV or JSON, sweep CSV, or .zip archives of them"),
});

export const BatchListQuerySchema = z.object({ sessionId: UuidSchema("Session").optional() });

export const FileIssueSchema = z.object({ row: z.number().int().nullable(), column: z.string().nullable(), message: z.string() });

const RunRefSchema = z.object({ id: z.string().uuid(), name: z.string() }).nullable();

export const BatchFileSchema = z.object({
  id: z.string().uuid(),
  position: z.number().int(),
  /** As uploaded; zip members as "archive.zip › path", sweep lines as "sweep.csv › line 7". */
  fileName: z.string(),
  format: BatchFileFormatSchema.nullable(),
  sizeBytes: z.number().int(),
  status: BatchFileStatusSchema,
  /** What went wrong (failed) or where the content already is (duplicate), naming file, row, column. */
  message: z.string().nullable(),
  issues: z.array(FileIssueSchema),
  run: RunRefSchema,
  duplicateOf: RunRefSchema,
  attempts: z.number().int(),
});
export type BatchFileDto = z.infer<typeof BatchFileSchema>;

export const BatchCountsSchema = z.object(Object.fromEntries(BATCH_FILE_STATUSES.map((s) => [s, z.number().int()])) as Record<BatchFileStatus, z.ZodNumber>);
export type BatchCounts = z.infer<typeof BatchCountsSchema>;

export const BatchSummarySchema = z.object({
  id: z.string().uuid(),
  labId: z.string().uuid(),
  session: z.object({ id: z.string().uuid(), title: z.string() }),
  origin: z.enum(["browser", "token"]),
  fileCount: z.number().int(),
  counts: BatchCountsSchema,
  /** True when every file is stored, failed or a duplicate. */
  done: z.boolean(),
  createdBy: PersonRefSchema,
  createdAt: z.string(),
  finishedAt: z.string().nullable(),
});
export type BatchSummaryDto = z.infer<typeof BatchSummarySchema>;

export const BatchSchema = BatchSummarySchema.extend({ files: z.array(BatchFileSchema) });
export type BatchDto = z.infer<typeof BatchSchema>;

export const BatchListSchema = z.object({ data: z.array(BatchSummarySchema) });

/**
 * The acquisition API's body: one run in the one-run JSON layout (README "File formats"),
 * validated exactly like such a file so errors name row and key alike.
 */
export const AcquisitionSchema = z.record(z.string(), z.unknown(), "Send the run as one JSON object (the one-run JSON layout).");
export type Acquisition = z.infer<typeof AcquisitionSchema>;

export const AcquisitionResultSchema = z.object({
  /** "stored": this request stored it; "duplicate": the same content was stored before. */
  status: z.enum(["stored", "duplicate"]),
  batchFileId: z.string().uuid(),
  run: RunDetailSchema,
});
export type AcquisitionResult = z.infer<typeof AcquisitionResultSchema>;
