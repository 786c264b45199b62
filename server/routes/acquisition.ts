import { LabSessionIdParamsSchema } from "@shared/schemas/labSessions";
import { AcquisitionResultSchema, AcquisitionSchema } from "@shared/schemas/batches";
import type { FileIssue } from "@shared/formats/runJson";
import { config } from "../config";
import { db } from "../db/dataSource";
import { BatchFile } from "../entities/BatchFile";
import { ApiRouter } from "../http/endpoint";
import { HttpError } from "../http/errors";
import { processBatchFile } from "../jobs/processBatchFile";
import { runPolicy } from "../policies/runs";
import { presentRunDetail } from "../presenters/run";
import { createBatch } from "../services/batches";
import { loadRunDetail } from "../services/runQueries";

/**
 * The acquisition PC's door: post one run as JSON the moment it is measured, get its
 * reconstruction back in the answer. It is a batch of one file, processed right here; its job is
 * queued too, to start only after the job timeout, so a run whose request died half-way is still
 * stored by a worker. Sending the same run again (a retry after a network error) answers
 * "duplicate" with the run stored the first time, never a second copy.
 */
export const acquisitionRouter = new ApiRouter("/labs");

acquisitionRouter.post(
  "/:labId/sessions/:sessionId/acquisitions",
  {
    summary: "Post one run (one-run JSON layout) into a session and get its reconstructions back; a repeat of the same run answers 200 \"duplicate\" with the stored run",
    auth: "user",
    tokenAccess: true,
    tags: ["batches"],
    params: LabSessionIdParamsSchema,
    body: AcquisitionSchema,
    response: AcquisitionResultSchema,
    status: 201,
  },
  async ({ user, params, body, res }) => {
    const role = await runPolicy.create(user, params.labId);
    const name = typeof body.name === "string" && body.name.trim() ? body.name.trim() : "Acquired run";
    const upload = { originalname: `${name.replace(/[\\/]/g, "-")}.json`, buffer: Buffer.from(JSON.stringify(body), "utf8") };
    const { files } = await createBatch(user, params.labId, params.sessionId, [upload], { startAfterSeconds: config().RHOMB_JOB_TIMEOUT_SECONDS });
    await processBatchFile(files[0].id, { finalAttempt: false });
    const file = await db().getRepository(BatchFile).findOneByOrFail({ id: files[0].id });
    if (file.status === "failed") throw acquisitionError(file.issues, file.message);
    const runId = file.status === "stored" ? file.runId : file.duplicateOfRunId;
    if (!runId) throw new HttpError(409, "conflict", "The run was stored but has since been deleted.");
    const result = { status: file.status as "stored" | "duplicate", batchFileId: file.id, run: presentRunDetail(await loadRunDetail(params.labId, runId), role) };
    if (file.status === "duplicate") res.status(200).json(result);
    return result;
  },
);

/** The file's issues as the API's field errors: rows.3.counts, name, … */
function acquisitionError(issues: FileIssue[], message: string | null): HttpError {
  const details = issues.map((i) => ({
    field: [...(i.row !== null ? ["rows", String(i.row - 1)] : []), ...(i.column ? [i.column] : [])].join(".") || "(body)",
    message: i.message,
  }));
  return new HttpError(400, "invalid", message ?? "The run was not stored.", details);
}
