import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { endpointRegistry } from "../../server/http/endpoint";
import { TestClient } from "../support/clients";
import { startTestApp, type TestApp } from "../support/testApp";

/** /api/openapi.json is built from the route declarations, so it must list each one exactly. */
describe("OpenAPI document completeness", () => {
  let t: TestApp;
  let doc: { paths: Record<string, Record<string, Record<string, unknown>>> };
  beforeAll(async () => {
    t = await startTestApp();
    doc = (await new TestClient(t).get("/api/openapi.json").expect(200)).body;
  });
  afterAll(() => t.close());

  it("lists every registered route, says whether it needs sign-in, and documents its inputs", () => {
    expect(endpointRegistry.length).toBeGreaterThan(20);
    for (const e of endpointRegistry) {
      const path = e.path.replace(/:([A-Za-z0-9_]+)/g, "{$1}");
      const op = doc.paths[path]?.[e.method] as
        | { summary: string; "x-requires-sign-in": boolean; security: unknown[]; parameters?: Array<{ name: string; in: string }>; requestBody?: unknown }
        | undefined;
      expect(op, `${e.method.toUpperCase()} ${e.path} is missing from /api/openapi.json`).toBeDefined();
      expect(op!.summary.length, `${e.path} has no summary`).toBeGreaterThan(3);
      expect(op!["x-requires-sign-in"], `${e.method} ${e.path}`).toBe(e.auth !== "public");
      expect(op!.security.length === 0, `${e.method} ${e.path} security`).toBe(e.auth === "public");
      for (const name of [...e.path.matchAll(/:([A-Za-z0-9_]+)/g)].map((m) => m[1])) {
        expect(op!.parameters?.some((p) => p.name === name && p.in === "path"), `${e.path} does not document path parameter ${name}`).toBe(true);
      }
      if (e.body) expect(op!.requestBody, `${e.method} ${e.path} has a body but no requestBody`).toBeDefined();
    }
    const documented = Object.entries(doc.paths).flatMap(([p, ops]) => Object.keys(ops).map((m) => `${m} ${p}`));
    expect(documented).toHaveLength(endpointRegistry.length);
  });

  it("marks the account routes correctly", () => {
    expect(doc.paths["/api/auth/sign-up"].post["x-requires-sign-in"]).toBe(false);
    expect(doc.paths["/api/invitations/accept"].post["x-requires-sign-in"]).toBe(false);
    expect(doc.paths["/api/labs/{labId}/members"].get["x-requires-sign-in"]).toBe(true);
    const signUp = doc.paths["/api/auth/sign-up"].post as { requestBody: { content: Record<string, { schema: { required: string[] } }> } };
    expect(signUp.requestBody.content["application/json"].schema.required.sort()).toEqual(["displayName", "email", "password"]);
  });
});
