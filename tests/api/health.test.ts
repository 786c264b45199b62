import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { HealthSchema } from "@shared/schemas/health";
import { startTestApp, type TestApp } from "../support/testApp";

describe("GET /api/health", () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  it("reports the API and the real database as up", async () => {
    const res = await request(t.app).get("/api/health").expect(200);
    const body = HealthSchema.parse(res.body);
    expect(body.status).toBe("ok");
    expect(body.database.status).toBe("up");
    if (body.database.status === "up") expect(body.database.version).toMatch(/^\d+/);
  });

  it("answers unknown API routes with the one error shape", async () => {
    const res = await request(t.app).get("/api/no-such-thing").expect(404);
    expect(res.body).toEqual({ error: { code: "not_found", message: "No API route GET /no-such-thing." } });
  });

  it("rejects malformed JSON with a clear 400", async () => {
    const res = await request(t.app).post("/api/health").set("Content-Type", "application/json").send("{not json");
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("bad_json");
  });

  it("sends security headers", async () => {
    const res = await request(t.app).get("/api/health");
    expect(res.headers["x-content-type-options"]).toBe("nosniff");
    expect(res.headers["content-security-policy"]).toContain("default-src 'self'");
    expect(res.headers["x-powered-by"]).toBeUndefined();
  });
});

describe("GET /api/openapi.json", () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  it("describes the declared routes, with request schemas and whether sign-in is needed", async () => {
    const res = await request(t.app).get("/api/openapi.json").expect(200);
    expect(res.body.openapi).toBe("3.1.0");
    const createLab = res.body.paths["/api/labs"].post;
    expect(createLab["x-requires-sign-in"]).toBe(true);
    expect(createLab.requestBody.content["application/json"].schema.required).toContain("name");
    expect(res.body.paths["/api/labs/{labId}"].get.parameters[0]).toMatchObject({ name: "labId", in: "path", required: true });
    expect(res.body.paths["/api/auth/sign-in"].post["x-requires-sign-in"]).toBe(false);
  });
});
