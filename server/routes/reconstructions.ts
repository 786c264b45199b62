import { CreateReconstructionSchema, ReconstructionIdParamsSchema, ReconstructionSchema } from "@shared/schemas/reconstructions";
import { RunIdParamsSchema } from "@shared/schemas/runs";
import { ApiRouter } from "../http/endpoint";
import { runPolicy } from "../policies/runs";
import { presentReconstruction } from "../presenters/reconstruction";
import { findReconstruction } from "../services/reconstructions";
import { addReconstruction } from "../services/runs";

export const reconstructionsRouter = new ApiRouter("/labs");
const tags = ["reconstructions"];

reconstructionsRouter.post(
  "/:labId/runs/:runId/reconstructions",
  { summary: "Reconstruct the run's current counts again with a method and corrections (older reconstructions are kept)", auth: "user", tokenAccess: true, tags, params: RunIdParamsSchema, body: CreateReconstructionSchema, response: ReconstructionSchema, status: 201 },
  async ({ user, params, body }) => {
    const role = await runPolicy.reconstruct(user, params.labId);
    const { reconstruction, revisionNumber } = await addReconstruction(user, params.labId, params.runId, body);
    return presentReconstruction(reconstruction, revisionNumber, role);
  },
);

reconstructionsRouter.get("/:labId/reconstructions/:reconstructionId", { summary: "One reconstruction", auth: "user", tokenAccess: true, tags, params: ReconstructionIdParamsSchema, response: ReconstructionSchema }, async ({ user, params }) => {
  const role = await runPolicy.view(user, params.labId);
  const { reconstruction, revisionNumber } = await findReconstruction(params.labId, params.reconstructionId);
  return presentReconstruction(reconstruction, revisionNumber, role);
});
