import { CreateLabSchema, LabIdParamsSchema, LabListSchema, LabSchema, UpdateLabSchema } from "@shared/schemas/labs";
import { db } from "../db/dataSource";
import { Lab } from "../entities/Lab";
import { ApiRouter } from "../http/endpoint";
import { authorizeLab } from "../policies/labAccess";
import { presentLab } from "../presenters/lab";
import { createLab, deleteLab, listLabsOf, updateLab } from "../services/labs";

export const labsRouter = new ApiRouter("/labs");
const tags = ["labs"];

labsRouter.get("/", { summary: "Labs the caller belongs to", auth: "user", tags, response: LabListSchema, tokenAccess: true }, async ({ user }) => {
  const labs = await listLabsOf(user);
  return { data: labs.map(({ lab, role }) => presentLab(lab, role)) };
});

labsRouter.post("/", { summary: "Create a lab (the caller becomes its owner)", auth: "user", tags, body: CreateLabSchema, response: LabSchema, status: 201 }, async ({ user, body }) => {
  const lab = await createLab(user, body);
  return presentLab(lab, "owner");
});

labsRouter.get("/:labId", { summary: "One lab", auth: "user", tags, params: LabIdParamsSchema, response: LabSchema, tokenAccess: true }, async ({ user, params }) => {
  const role = await authorizeLab(user, params.labId, "read");
  const lab = await db().getRepository(Lab).findOneByOrFail({ id: params.labId });
  return presentLab(lab, role);
});

labsRouter.patch("/:labId", { summary: "Rename a lab or change its institution (owners)", auth: "user", tags, params: LabIdParamsSchema, body: UpdateLabSchema, response: LabSchema }, async ({ user, params, body }) => {
  const role = await authorizeLab(user, params.labId, "manage");
  return presentLab(await updateLab(params.labId, body), role);
});

labsRouter.delete("/:labId", { summary: "Delete a lab and everything in it (owners)", auth: "user", tags, params: LabIdParamsSchema }, async ({ user, params }) => {
  await authorizeLab(user, params.labId, "manage");
  await deleteLab(params.labId);
  return undefined;
});
