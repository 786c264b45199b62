import { buildOpenApiDocument } from "../http/openapi";
import { ApiRouter } from "../http/endpoint";

export const openApiRouter = new ApiRouter("");

openApiRouter.get("/openapi.json", { summary: "This API, described as OpenAPI 3.1", auth: "public", tags: ["meta"] }, async () =>
  buildOpenApiDocument(process.env.npm_package_version ?? "0.1.0"),
);
