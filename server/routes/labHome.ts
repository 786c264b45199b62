import { LabHomeSchema } from "@shared/schemas/labHome";
import { LabIdParamsSchema } from "@shared/schemas/labs";
import { ApiRouter } from "../http/endpoint";
import { allowedActions } from "../policies/labAccess";
import { runPolicy } from "../policies/runs";
import { presentLabSession } from "../presenters/labSession";
import { presentRun } from "../presenters/run";
import { labHome } from "../services/labHome";

export const labHomeRouter = new ApiRouter("/labs");

labHomeRouter.get("/:labId/home", { summary: "A lab's first page: totals, recent sessions and runs, best fidelity per source", auth: "user", tokenAccess: true, tags: ["labs"], params: LabIdParamsSchema, response: LabHomeSchema }, async ({ user, params }) => {
  const role = await runPolicy.view(user, params.labId);
  const home = await labHome(params.labId);
  return {
    totals: home.totals,
    recentSessions: home.recentSessions.map((s) => presentLabSession(s.labSession, s.runCount, role)),
    recentRuns: home.recentRuns.map((r) => presentRun(r, role)),
    bestBySource: home.bestBySource.map(({ source, best }) => ({ source: { id: source.id, name: source.name, targetState: source.targetState }, best })),
    can: allowedActions(role),
  };
});
