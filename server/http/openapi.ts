import { z, type ZodType } from "zod";
import { endpointRegistry, type RegisteredEndpoint } from "./endpoint";

/**
 * The OpenAPI 3.1 document, built from the same zod schemas that validate requests (zod's own
 * JSON Schema export), so documentation and validation cannot drift apart.
 */
export function buildOpenApiDocument(version: string): Record<string, unknown> {
  const paths: Record<string, Record<string, unknown>> = {};
  for (const e of endpointRegistry) {
    const path = e.path.replace(/:([A-Za-z0-9_]+)/g, "{$1}");
    paths[path] ??= {};
    paths[path][e.method] = operation(e);
  }
  return {
    openapi: "3.1.0",
    info: { title: "Rhomb API", version, description: "Two-photon polarization tomography notebook. Errors: { error: { code, message, details? } }. Browser sessions send the token from GET /api/auth/csrf-token in an X-CSRF-Token header with every POST, PUT, PATCH and DELETE; requests with a Bearer API token do not." },
    servers: [{ url: "/" }],
    components: {
      securitySchemes: {
        session: { type: "apiKey", in: "cookie", name: "rhomb.sid", description: "Browser sign-in session" },
        token: { type: "http", scheme: "bearer", description: "Personal API token, scoped to one lab" },
      },
    },
    paths,
  };
}

function jsonSchema(schema: ZodType, io: "input" | "output"): Record<string, unknown> {
  return z.toJSONSchema(schema, { io, unrepresentable: "any", target: "draft-2020-12" }) as Record<string, unknown>;
}

function operation(e: RegisteredEndpoint): Record<string, unknown> {
  const parameters: unknown[] = [];
  for (const [where, schema] of [["path", e.params], ["query", e.query]] as const) {
    if (!schema) continue;
    const js = jsonSchema(schema, "input") as { properties?: Record<string, unknown>; required?: string[] };
    for (const [name, prop] of Object.entries(js.properties ?? {})) {
      parameters.push({ name, in: where, required: where === "path" || (js.required ?? []).includes(name), schema: prop });
    }
  }
  const success = String(e.status ?? (e.response ? 200 : 204));
  return {
    summary: e.summary,
    tags: e.tags,
    "x-requires-sign-in": e.auth !== "public",
    security: e.auth === "public" ? [] : e.tokenAccess ? [{ session: [] }, { token: [] }] : [{ session: [] }],
    ...(parameters.length ? { parameters } : {}),
    ...(e.body
      ? { requestBody: { required: true, content: { [e.upload ? "multipart/form-data" : "application/json"]: { schema: jsonSchema(e.body, "input") } } } }
      : {}),
    responses: {
      [success]: e.response ? { description: "Success", content: { "application/json": { schema: jsonSchema(e.response, "output") } } } : { description: "Success" },
      default: { description: "Error: { error: { code, message, details? } }" },
    },
  };
}
