import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { LabListSchema, LabSchema } from "@shared/schemas/labs";
import { labWithRoles, type LabFixture } from "../support/clients";
import { startTestApp, type TestApp } from "../support/testApp";

describe("labs", () => {
  let t: TestApp;
  let f: LabFixture;
  beforeAll(async () => {
    t = await startTestApp();
    f = await labWithRoles(t);
  });
  afterAll(() => t.close());

  it("lists only the caller's labs, with their role and allowed actions", async () => {
    const res = await f.clients.viewer.get("/api/labs").expect(200);
    const { data } = LabListSchema.parse(res.body);
    expect(data.map((l) => l.id)).toEqual([f.lab.id]);
    expect(data[0].role).toBe("viewer");
    expect(data[0].can).toEqual({ read: true, write: false, manage: false });
  });

  it("hides another lab behind a 404, and asks anonymous callers to sign in", async () => {
    await f.clients.outsider.get(`/api/labs/${f.lab.id}`).expect(404);
    const anon = await f.clients.anonymous.get(`/api/labs/${f.lab.id}`).expect(401);
    expect(anon.body.error.code).toBe("unauthenticated");
  });

  it("creates a lab whose creator is its owner", async () => {
    const res = await f.clients.member.post("/api/labs", { name: "Second lab", institution: "" }).expect(201);
    const lab = LabSchema.parse(res.body);
    expect(lab.role).toBe("owner");
    expect(lab.can.manage).toBe(true);
  });

  it("names the field at fault when the body is invalid", async () => {
    const res = await f.clients.member.post("/api/labs", { name: "  " }).expect(400);
    expect(res.body.error.code).toBe("invalid");
    expect(res.body.error.details).toEqual([{ field: "name", message: "Give the lab a name." }]);
  });
});
