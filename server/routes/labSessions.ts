import { LabIdParamsSchema } from "@shared/schemas/labs";
import { CreateLabSessionSchema, LabSessionIdParamsSchema, LabSessionListQuerySchema, LabSessionPageSchema, LabSessionSchema, UpdateLabSessionSchema } from "@shared/schemas/labSessions";
import { ApiRouter } from "../http/endpoint";
import { labSessionPolicy } from "../policies/labSessions";
import { presentLabSession } from "../presenters/labSession";
import { createLabSession, getLabSession, listLabSessions, updateLabSession } from "../services/labSessions";
import { pageInfo } from "../services/listing";

export const labSessionsRouter = new ApiRouter("/labs");
const tags = ["sessions"];

labSessionsRouter.get("/:labId/sessions", { summary: "Sessions of a lab (paged, sortable, filterable by source and date)", auth: "user", tokenAccess: true, tags, params: LabIdParamsSchema, query: LabSessionListQuerySchema, response: LabSessionPageSchema }, async ({ user, params, query }) => {
  const role = await labSessionPolicy.view(user, params.labId);
  const { items, total } = await listLabSessions(params.labId, query);
  return { data: items.map((i) => presentLabSession(i.labSession, i.runCount, role)), page: pageInfo(query.page, query.pageSize, total) };
});

labSessionsRouter.post("/:labId/sessions", { summary: "Start a session (the setup of a day of measurements)", auth: "user", tags, params: LabIdParamsSchema, body: CreateLabSessionSchema, response: LabSessionSchema, status: 201 }, async ({ user, params, body }) => {
  const role = await labSessionPolicy.create(user, params.labId);
  const { labSession, runCount } = await createLabSession(user, params.labId, body);
  return presentLabSession(labSession, runCount, role);
});

labSessionsRouter.get("/:labId/sessions/:sessionId", { summary: "One session with its setup", auth: "user", tokenAccess: true, tags, params: LabSessionIdParamsSchema, response: LabSessionSchema }, async ({ user, params }) => {
  const role = await labSessionPolicy.view(user, params.labId);
  const { labSession, runCount } = await getLabSession(params.labId, params.sessionId);
  return presentLabSession(labSession, runCount, role);
});

labSessionsRouter.patch("/:labId/sessions/:sessionId", { summary: "Edit a session's setup or notes (stored runs keep the conventions they used)", auth: "user", tags, params: LabSessionIdParamsSchema, body: UpdateLabSessionSchema, response: LabSessionSchema }, async ({ user, params, body }) => {
  const role = await labSessionPolicy.edit(user, params.labId);
  const { labSession, runCount } = await updateLabSession(user, params.labId, params.sessionId, body);
  return presentLabSession(labSession, runCount, role);
});
