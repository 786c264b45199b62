import type { RequestHandler } from "express";
import multer, { MulterError } from "multer";
import { LIMITS } from "@shared/limits";
import { LabIdParamsSchema } from "@shared/schemas/labs";
import { BatchIdParamsSchema, BatchListQuerySchema, BatchListSchema, BatchSchema, BatchUploadSchema } from "@shared/schemas/batches";
import { LabSessionIdParamsSchema } from "@shared/schemas/labSessions";
import { ApiRouter } from "../http/endpoint";
import { HttpError, invalid, payloadTooLarge, unauthenticated } from "../http/errors";
import { runPolicy } from "../policies/runs";
import { presentBatch, presentBatchSummary } from "../presenters/batch";
import { createBatch, getBatch, listBatches } from "../services/batches";

export const batchesRouter = new ApiRouter("/labs");
const tags = ["batches"];
const MB = (bytes: number) => `${(bytes / 1_000_000).toLocaleString("en")} MB`;

const parseFiles = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: LIMITS.batchUploadBytes, files: LIMITS.batchFiles, fields: 10, fieldSize: 10_000 },
}).any();

/**
 * Reads the files of a batch — after checking the caller may add runs to the lab and the
 * request's declared size, so nobody else can make us buffer 50 MB. Browsers, fetch() and curl all send
 * Content-Length with multipart bodies.
 */
const batchUpload: RequestHandler = async (req, res, next) => {
  if (!req.user) return next(unauthenticated());
  try {
    await runPolicy.create(req.user, String(req.params.labId));
  } catch (err) {
    return next(err);
  }
  const declared = req.get("content-length");
  if (!declared) return next(new HttpError(411, "length_required", "Send the batch with a Content-Length header (browsers, fetch() and curl do this themselves)."));
  if (Number(declared) > LIMITS.batchUploadBytes) {
    return next(payloadTooLarge(`A batch upload is at most ${MB(LIMITS.batchUploadBytes)}; this one is ${MB(Number(declared))}. Nothing was stored — split it into several batches.`));
  }
  parseFiles(req, res, (err?: unknown) => next(err instanceof MulterError ? uploadError(err) : err));
};

function uploadError(err: MulterError): HttpError {
  switch (err.code) {
    case "LIMIT_FILE_COUNT":
      return payloadTooLarge(`One batch takes at most ${LIMITS.batchFiles.toLocaleString("en")} files. Nothing was stored — split it into several batches.`);
    case "LIMIT_FILE_SIZE":
      return payloadTooLarge(`One uploaded file (or zip) is at most ${MB(LIMITS.batchUploadBytes)}. Nothing was stored.`);
    default:
      return invalid(err.field ?? "files", err.message);
  }
}

batchesRouter.post(
  "/:labId/sessions/:sessionId/batches",
  {
    summary: "Upload many run files at once (one-run CSV or JSON, sweep CSV, or zips of them; multipart) into a lab session; each is queued and stored as its own run",
    auth: "user",
    tokenAccess: true,
    tags,
    params: LabSessionIdParamsSchema,
    body: BatchUploadSchema,
    upload: batchUpload,
    response: BatchSchema,
    status: 202,
  },
  async ({ user, params, req }) => {
    await runPolicy.create(user, params.labId);
    const files = (req.files as Express.Multer.File[] | undefined) ?? [];
    const { batch } = await createBatch(user, params.labId, params.sessionId, files);
    return presentBatch(await getBatch(params.labId, batch.id));
  },
);

batchesRouter.get("/:labId/batches", { summary: "Recent batch uploads of the lab (optionally of one session), with counts per status", auth: "user", tokenAccess: true, tags, params: LabIdParamsSchema, query: BatchListQuerySchema, response: BatchListSchema }, async ({ user, params, query }) => {
  await runPolicy.view(user, params.labId);
  return { data: (await listBatches(params.labId, query.sessionId)).map(presentBatchSummary) };
});

batchesRouter.get("/:labId/batches/:batchId", { summary: "Progress of a batch: counts per status and every file's status, message and run", auth: "user", tokenAccess: true, tags, params: BatchIdParamsSchema, response: BatchSchema }, async ({ user, params }) => {
  await runPolicy.view(user, params.labId);
  return presentBatch(await getBatch(params.labId, params.batchId));
});
