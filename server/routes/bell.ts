import { BellTestParamsSchema, BellTestQuerySchema, BellTestSchema } from "@shared/schemas/bell";
import { ApiRouter } from "../http/endpoint";
import { runPolicy } from "../policies/runs";
import { bellTest } from "../services/bellAnalysis";

export const bellRouter = new ApiRouter("/labs");

bellRouter.get(
  "/:labId/runs/:runId/bell-test",
  {
    summary: "CHSH of a Bell-test run: each E ± σ, S ± σ_S, significance, and what the session's reconstructed ρ predicts",
    auth: "user",
    tokenAccess: true,
    tags: ["analyses"],
    params: BellTestParamsSchema,
    query: BellTestQuerySchema,
    response: BellTestSchema,
  },
  async ({ user, params, query }) => {
    await runPolicy.view(user, params.labId);
    return bellTest(params.labId, params.runId, query);
  },
);
