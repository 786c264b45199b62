import { LabIdParamsSchema } from "@shared/schemas/labs";
import { LabSessionIdParamsSchema } from "@shared/schemas/labSessions";
import { CreateRevisionSchema, CreateRunSchema, RunDetailSchema, RunIdParamsSchema, RunListQuerySchema, RunPageSchema, RunSchema, UpdateRunSchema, UploadRunFieldsSchema } from "@shared/schemas/runs";
import multer from "multer";
import { LIMITS } from "@shared/limits";
import { ApiRouter } from "../http/endpoint";
import { runPolicy } from "../policies/runs";
import { presentRun, presentRunDetail } from "../presenters/run";
import { pageInfo } from "../services/listing";
import { findRun, listRuns, loadRunDetail, loadRunSummaries } from "../services/runQueries";
import { createRun, reviseRun, updateRun } from "../services/runs";
import { uploadRun } from "../services/uploads";

/** One counts file per request, kept in memory (it is stored as an attachment byte for byte). */
const singleCountsFile = multer({ storage: multer.memoryStorage(), limits: { fileSize: LIMITS.uploadBytes, files: 1, fields: 10, fieldSize: LIMITS.notesLength * 4 } }).single("file");

export const runsRouter = new ApiRouter("/labs");
const tags = ["runs"];

runsRouter.get("/:labId/runs", { summary: "Runs of a lab with their key figures (paged; filter by session, source, kind; sort by figures)", auth: "user", tokenAccess: true, tags, params: LabIdParamsSchema, query: RunListQuerySchema, response: RunPageSchema }, async ({ user, params, query }) => {
  const role = await runPolicy.view(user, params.labId);
  const { items, total } = await listRuns(params.labId, query);
  return { data: items.map((i) => presentRun(i, role)), page: pageInfo(query.page, query.pageSize, total) };
});

runsRouter.post(
  "/:labId/sessions/:sessionId/runs",
  { summary: "Record a run from JSON rows; computes linear inversion and maximum likelihood with Monte Carlo uncertainties", auth: "user", tokenAccess: true, tags, params: LabSessionIdParamsSchema, body: CreateRunSchema, response: RunDetailSchema, status: 201 },
  async ({ user, params, body }) => {
    const role = await runPolicy.create(user, params.labId);
    return presentRunDetail(await createRun(user, params.labId, params.sessionId, body), role);
  },
);

runsRouter.post(
  "/:labId/sessions/:sessionId/runs/upload",
  { summary: "Record a run from one counts CSV (multipart field `file`; README “Run file format”); the file is kept as an attachment", auth: "user", tokenAccess: true, tags, params: LabSessionIdParamsSchema, body: UploadRunFieldsSchema, upload: singleCountsFile, response: RunDetailSchema, status: 201 },
  async ({ user, params, body, req }) => {
    const role = await runPolicy.create(user, params.labId);
    return presentRunDetail(await uploadRun(user, params.labId, params.sessionId, req.file, body), role);
  },
);

runsRouter.get("/:labId/runs/:runId", { summary: "A run: current rows, every revision, every reconstruction, attachments", auth: "user", tokenAccess: true, tags, params: RunIdParamsSchema, response: RunDetailSchema }, async ({ user, params }) => {
  const role = await runPolicy.view(user, params.labId);
  return presentRunDetail(await loadRunDetail(params.labId, params.runId), role);
});

runsRouter.patch("/:labId/runs/:runId", { summary: "Edit a run's name, notes or conditions (counts change only through a revision)", auth: "user", tags, params: RunIdParamsSchema, body: UpdateRunSchema, response: RunSchema }, async ({ user, params, body }) => {
  const role = await runPolicy.edit(user, params.labId);
  await updateRun(user, params.labId, params.runId, body);
  const [summary] = await loadRunSummaries([(await findRun(params.labId, params.runId)).id]);
  return presentRun(summary, role);
});

runsRouter.post(
  "/:labId/runs/:runId/revisions",
  { summary: "Correct a run's counts: a new revision (the old one is kept) with fresh reconstructions", auth: "user", tags, params: RunIdParamsSchema, body: CreateRevisionSchema, response: RunDetailSchema, status: 201 },
  async ({ user, params, body }) => {
    const role = await runPolicy.revise(user, params.labId);
    return presentRunDetail(await reviseRun(user, params.labId, params.runId, body), role);
  },
);
