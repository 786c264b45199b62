import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { MemberListSchema } from "@shared/schemas/members";
import { Lab } from "../../server/entities/Lab";
import { LabMembership } from "../../server/entities/LabMembership";
import { labWithRoles, type LabFixture } from "../support/clients";
import { startTestApp, type TestApp } from "../support/testApp";

describe("members and roles", () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  let f: LabFixture;
  beforeAll(async () => {
    f = await labWithRoles(t);
  });

  it("lists the lab's members, owners first, with the caller marked", async () => {
    const res = await f.clients.viewer.get(`/api/labs/${f.lab.id}/members`).expect(200);
    const list = MemberListSchema.parse(res.body);
    expect(list.data.map((m) => m.role)).toEqual(["owner", "member", "viewer"]);
    expect(list.data.find((m) => m.isYou)?.userId).toBe(f.users.viewer.id);
    expect(list.data.some((m) => m.userId === f.users.outsider.id)).toBe(false);
    expect(list.can).toEqual({ read: true, write: false, manage: false });
  });

  it("lets owners change roles, and nobody else", async () => {
    await f.clients.member.patch(`/api/labs/${f.lab.id}/members/${f.users.viewer.id}`, { role: "member" }).expect(403);
    const res = await f.clients.owner.patch(`/api/labs/${f.lab.id}/members/${f.users.viewer.id}`, { role: "member" }).expect(200);
    expect(res.body).toMatchObject({ userId: f.users.viewer.id, role: "member" });
    await f.clients.owner.patch(`/api/labs/${f.lab.id}/members/${f.users.viewer.id}`, { role: "viewer" }).expect(200);
    const bad = await f.clients.owner.patch(`/api/labs/${f.lab.id}/members/${f.users.viewer.id}`, { role: "boss" }).expect(400);
    expect(bad.body.error.details[0].field).toBe("role");
  });

  it("never leaves a lab without an owner", async () => {
    const demote = await f.clients.owner.patch(`/api/labs/${f.lab.id}/members/${f.users.owner.id}`, { role: "member" }).expect(409);
    expect(demote.body.error).toMatchObject({ code: "last_owner", message: expect.stringMatching(/at least one owner/) });
    const leave = await f.clients.owner.delete(`/api/labs/${f.lab.id}/members/${f.users.owner.id}`).expect(409);
    expect(leave.body.error.code).toBe("last_owner");
    // With a second owner, the first may step down.
    await f.clients.owner.patch(`/api/labs/${f.lab.id}/members/${f.users.member.id}`, { role: "owner" }).expect(200);
    await f.clients.owner.patch(`/api/labs/${f.lab.id}/members/${f.users.owner.id}`, { role: "member" }).expect(200);
    expect(await t.dataSource.getRepository(LabMembership).countBy({ labId: f.lab.id, role: "owner" })).toBe(1);
  });

  it("keeps an owner even when two owners step down at the same moment", async () => {
    const g = await labWithRoles(t);
    await g.clients.owner.patch(`/api/labs/${g.lab.id}/members/${g.users.member.id}`, { role: "owner" }).expect(200);
    const [a, b] = await Promise.all([
      g.clients.owner.patch(`/api/labs/${g.lab.id}/members/${g.users.owner.id}`, { role: "viewer" }),
      g.clients.member.patch(`/api/labs/${g.lab.id}/members/${g.users.member.id}`, { role: "viewer" }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    expect(await t.dataSource.getRepository(LabMembership).countBy({ labId: g.lab.id, role: "owner" })).toBe(1);
  });

  it("lets a viewer leave by themselves but not remove others; owners remove people", async () => {
    const g = await labWithRoles(t);
    await g.clients.viewer.delete(`/api/labs/${g.lab.id}/members/${g.users.member.id}`).expect(403);
    await g.clients.viewer.delete(`/api/labs/${g.lab.id}/members/${g.users.viewer.id}`).expect(204);
    await g.clients.viewer.get(`/api/labs/${g.lab.id}`).expect(404);
    await g.clients.owner.delete(`/api/labs/${g.lab.id}/members/${g.users.member.id}`).expect(204);
    await g.clients.member.get(`/api/labs/${g.lab.id}/members`).expect(404);
    await g.clients.owner.delete(`/api/labs/${g.lab.id}/members/${g.users.outsider.id}`).expect(404);
  });
});

describe("lab settings and deletion", () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  it("lets owners rename a lab; members may not", async () => {
    const f = await labWithRoles(t);
    await f.clients.member.patch(`/api/labs/${f.lab.id}`, { name: "Hijacked" }).expect(403);
    const res = await f.clients.owner.patch(`/api/labs/${f.lab.id}`, { name: "Entangled Photon Lab" }).expect(200);
    expect(res.body).toMatchObject({ name: "Entangled Photon Lab", institution: "Test Institute" });
  });

  it("deletes a lab only for its owner, with everything in it", async () => {
    const f = await labWithRoles(t);
    await f.clients.member.delete(`/api/labs/${f.lab.id}`).expect(403);
    await f.clients.outsider.delete(`/api/labs/${f.lab.id}`).expect(404);
    await f.clients.owner.post(`/api/labs/${f.lab.id}/invitations`, { email: "someone@partner.example", role: "viewer" }).expect(201);
    await f.clients.owner.delete(`/api/labs/${f.lab.id}`).expect(204);
    expect(await t.dataSource.getRepository(Lab).countBy({ id: f.lab.id })).toBe(0);
    expect(await t.dataSource.getRepository(LabMembership).countBy({ labId: f.lab.id })).toBe(0);
    await f.clients.owner.get(`/api/labs/${f.lab.id}`).expect(404);
  });
});
