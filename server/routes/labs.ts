import { CreateLabSchema, LabIdParamsSchema, LabListSchema, LabSchema } from "@shared/schemas/labs";
import { db } from "../db/dataSource";
import { Lab } from "../entities/Lab";
import { ApiRouter } from "../http/endpoint";
import { authorizeLab } from "../policies/labAccess";
import { presentLab } from "../presenters/lab";
import { createLab, listLabsOf } from "../services/labs";

export const labsRouter = new ApiRouter("/labs");

labsRouter.get("/", { summary: "Labs the caller belongs to", auth: "user", tags: ["labs"], response: LabListSchema }, async ({ user }) => {
  const labs = await listLabsOf(user);
  return { data: labs.map(({ lab, role }) => presentLab(lab, role)) };
});

labsRouter.post("/", { summary: "Create a lab (the caller becomes its owner)", auth: "user", tags: ["labs"], body: CreateLabSchema, response: LabSchema, status: 201 }, async ({ user, body }) => {
  const lab = await createLab(user, body);
  return presentLab(lab, "owner");
});

labsRouter.get("/:labId", { summary: "One lab", auth: "user", tags: ["labs"], params: LabIdParamsSchema, response: LabSchema }, async ({ user, params }) => {
  const role = await authorizeLab(user, params.labId, "read");
  const lab = await db().getRepository(Lab).findOneByOrFail({ id: params.labId });
  return presentLab(lab, role);
});
