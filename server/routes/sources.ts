import { LabIdParamsSchema } from "@shared/schemas/labs";
import { CreateSourceSchema, SourceIdParamsSchema, SourceListQuerySchema, SourcePageSchema, SourceSchema, UpdateSourceSchema } from "@shared/schemas/sources";
import { ApiRouter } from "../http/endpoint";
import { sourcePolicy } from "../policies/sources";
import { presentSource } from "../presenters/source";
import { createSource, getSource, listSources, updateSource } from "../services/sources";
import { pageInfo } from "../services/listing";

export const sourcesRouter = new ApiRouter("/labs");
const tags = ["sources"];

sourcesRouter.get("/:labId/sources", { summary: "Sources of a lab (paged, sortable, searchable)", auth: "user", tokenAccess: true, tags, params: LabIdParamsSchema, query: SourceListQuerySchema, response: SourcePageSchema }, async ({ user, params, query }) => {
  const role = await sourcePolicy.view(user, params.labId);
  const { items, total } = await listSources(params.labId, query);
  return { data: items.map((i) => presentSource(i.source, i.sessionCount, role)), page: pageInfo(query.page, query.pageSize, total) };
});

sourcesRouter.post("/:labId/sources", { summary: "Add a source", auth: "user", tags, params: LabIdParamsSchema, body: CreateSourceSchema, response: SourceSchema, status: 201 }, async ({ user, params, body }) => {
  const role = await sourcePolicy.create(user, params.labId);
  const { source, sessionCount } = await createSource(user, params.labId, body);
  return presentSource(source, sessionCount, role);
});

sourcesRouter.get("/:labId/sources/:sourceId", { summary: "One source", auth: "user", tokenAccess: true, tags, params: SourceIdParamsSchema, response: SourceSchema }, async ({ user, params }) => {
  const role = await sourcePolicy.view(user, params.labId);
  const { source, sessionCount } = await getSource(params.labId, params.sourceId);
  return presentSource(source, sessionCount, role);
});

sourcesRouter.patch("/:labId/sources/:sourceId", { summary: "Edit a source", auth: "user", tags, params: SourceIdParamsSchema, body: UpdateSourceSchema, response: SourceSchema }, async ({ user, params, body }) => {
  const role = await sourcePolicy.edit(user, params.labId);
  const { source, sessionCount } = await updateSource(user, params.labId, params.sourceId, body);
  return presentSource(source, sessionCount, role);
});
