import type { Response } from "express";
import { ReconstructionExportParamsSchema, ReportParamsSchema, RunCountsQuerySchema, SessionExportParamsSchema } from "@shared/schemas/exports";
import { RunIdParamsSchema } from "@shared/schemas/runs";
import { SnapshotSchema } from "@shared/schemas/shares";
import type { ExportFile } from "@shared/formats/snapshotExports";
import { ApiRouter } from "../http/endpoint";
import { sharePolicy } from "../policies/shares";
import { reconstructionExportFile, runCountsFile, sessionMetricsFile, snapshotOf } from "../services/exports";

/** Export files (CSV / JSON, layouts in README "Sharing and exports") and printable-report data. */
export const exportsRouter = new ApiRouter("/labs");
const tags = ["exports"];

export function sendFile(res: Response, file: ExportFile): void {
  res.setHeader("Content-Type", file.contentType);
  res.setHeader("Content-Disposition", `attachment; filename="${file.fileName}"`);
  res.setHeader("Cache-Control", "no-store");
  res.status(200).send(file.text);
}

exportsRouter.get("/:labId/runs/:runId/counts.csv", { summary: "A run's raw counts as CSV (current revision, or ?revision=n)", auth: "user", tokenAccess: true, tags, params: RunIdParamsSchema, query: RunCountsQuerySchema }, async ({ user, res, params, query }) => {
  await sharePolicy.export(user, params.labId);
  sendFile(res, await runCountsFile(params.labId, params.runId, query.revision));
});

exportsRouter.get("/:labId/reconstructions/:reconstructionId/export/:file", { summary: "ρ (rho.csv, rho.json) or the figures of merit (metrics.csv, metrics.json) of a reconstruction", auth: "user", tokenAccess: true, tags, params: ReconstructionExportParamsSchema }, async ({ user, res, params }) => {
  await sharePolicy.export(user, params.labId);
  sendFile(res, await reconstructionExportFile(params.labId, params.reconstructionId, params.file));
});

exportsRouter.get("/:labId/sessions/:sessionId/export/:file", { summary: "Figures of merit of every reconstruction in a session (metrics.csv, metrics.json)", auth: "user", tokenAccess: true, tags, params: SessionExportParamsSchema }, async ({ user, res, params }) => {
  await sharePolicy.export(user, params.labId);
  sendFile(res, await sessionMetricsFile(params.labId, params.sessionId, params.file));
});

exportsRouter.get("/:labId/reports/:itemType/:itemId", { summary: "Everything a printable report of a session, run or reconstruction shows (the same content a share shows)", auth: "user", tags, params: ReportParamsSchema, response: SnapshotSchema }, async ({ user, params }) => {
  await sharePolicy.export(user, params.labId);
  return snapshotOf(params.labId, params.itemType, params.itemId);
});
