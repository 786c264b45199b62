import { CompareQuerySchema, CompareSchema } from "@shared/schemas/compare";
import { LabIdParamsSchema } from "@shared/schemas/labs";
import { ApiRouter } from "../http/endpoint";
import { runPolicy } from "../policies/runs";
import { presentReconstruction } from "../presenters/reconstruction";
import { presentRun } from "../presenters/run";
import { compare } from "../services/compare";

export const compareRouter = new ApiRouter("/labs");

compareRouter.get(
  "/:labId/compare",
  { summary: "Two or more runs side by side: their reconstructions and the differences to the first", auth: "user", tokenAccess: true, tags: ["runs"], params: LabIdParamsSchema, query: CompareQuerySchema, response: CompareSchema },
  async ({ user, params, query }) => {
    const role = await runPolicy.view(user, params.labId);
    const { items, differences } = await compare(params.labId, query);
    return {
      method: query.method,
      items: items.map((i) => ({ run: presentRun(i.summary, role), reconstruction: presentReconstruction(i.reconstruction, i.revisionNumber, role) })),
      differences,
    };
  },
);
