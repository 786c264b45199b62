import { TrendParamsSchema, TrendQuerySchema, TrendSchema } from "@shared/schemas/trends";
import { ApiRouter } from "../http/endpoint";
import { runPolicy } from "../policies/runs";
import { trendOf } from "../services/trends";

export const trendsRouter = new ApiRouter("/labs");

trendsRouter.get(
  "/:labId/trends",
  {
    summary: "Figures and parameters of every run of a session or source, for trend plots",
    auth: "user",
    tokenAccess: true,
    tags: ["analyses"],
    params: TrendParamsSchema,
    query: TrendQuerySchema,
    response: TrendSchema,
  },
  async ({ user, params, query }) => {
    await runPolicy.view(user, params.labId);
    return trendOf(params.labId, query);
  },
);
