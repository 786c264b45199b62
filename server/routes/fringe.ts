import { FringeAnalysisSchema, FringeScanParamsSchema, FringeScanQuerySchema } from "@shared/schemas/fringe";
import { ApiRouter } from "../http/endpoint";
import { runPolicy } from "../policies/runs";
import { fringeScan } from "../services/fringeAnalysis";

export const fringeRouter = new ApiRouter("/labs");

fringeRouter.get(
  "/:labId/runs/:runId/fringe-fit",
  {
    summary: "Visibility fits of a fringe-scan run, one per setting of the fixed arm, with visibilities per basis",
    auth: "user",
    tokenAccess: true,
    tags: ["analyses"],
    params: FringeScanParamsSchema,
    query: FringeScanQuerySchema,
    response: FringeAnalysisSchema,
  },
  async ({ user, params, query }) => {
    await runPolicy.view(user, params.labId);
    return fringeScan(params.labId, params.runId, query);
  },
);
