import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { CreatedInvitationSchema, InvitationListSchema, InvitationPreviewSchema } from "@shared/schemas/invitations";
import { Invitation } from "../../server/entities/Invitation";
import { LabMembership } from "../../server/entities/LabMembership";
import { User } from "../../server/entities/User";
import { TestClient, createUser, labWithRoles, signedInClient, type LabFixture } from "../support/clients";
import { linkToken, mailTo } from "../support/mail";
import { startTestApp, type TestApp } from "../support/testApp";

const newcomer = () => `newcomer-${randomUUID().slice(0, 8)}@partner.example`;

describe("invitations by e-mail", () => {
  let t: TestApp;
  let f: LabFixture;
  beforeAll(async () => {
    t = await startTestApp();
    f = await labWithRoles(t);
  });
  afterAll(() => t.close());

  async function invite(email: string, role = "viewer") {
    const res = await f.clients.owner.post(`/api/labs/${f.lab.id}/invitations`, { email, role }).expect(201);
    const created = CreatedInvitationSchema.parse(res.body);
    expect(created.mail).toEqual({ sent: true });
    return { created, token: linkToken(await mailTo(email, /invites you/), "/invitation") };
  }

  it("signs a newcomer up through the link, confirmed, with the invited role; the link then answers 410", async () => {
    const email = newcomer();
    const { token } = await invite(email, "viewer");
    const browser = new TestClient(t);
    const preview = InvitationPreviewSchema.parse((await browser.post("/api/invitations/preview", { token }).expect(200)).body);
    expect(preview).toMatchObject({ labName: f.lab.name, email, role: "viewer", accountExists: false, invitedBy: "Owner" });

    const missing = await browser.post("/api/invitations/accept", { token }).expect(400);
    expect(missing.body.error.details[0].field).toBe("displayName");

    const res = await browser.post("/api/invitations/accept", { token, displayName: "Nia Newcomer", password: "partner-photon-pair" }).expect(200);
    expect(res.body.lab).toMatchObject({ id: f.lab.id, role: "viewer" });
    const me = await browser.get("/api/auth/me").expect(200);
    expect(me.body).toMatchObject({ email, emailVerified: true });
    await browser.get(`/api/labs/${f.lab.id}`).expect(200);

    const reused = await new TestClient(t).post("/api/invitations/accept", { token, displayName: "Thief", password: "stolen-link-used" }).expect(410);
    expect(reused.body.error.message).toMatch(/already used/);
    await new TestClient(t).post("/api/invitations/preview", { token }).expect(410);
  });

  it("adds the lab to an existing account when its owner accepts signed in", async () => {
    const user = await createUser(t, "Existing");
    const { token } = await invite(user.email, "member");
    const anonymous = await new TestClient(t).post("/api/invitations/accept", { token, displayName: "X", password: "whatever-long-enough" }).expect(409);
    expect(anonymous.body.error.code).toBe("account_exists");
    const client = await signedInClient(t, user);
    const res = await client.post("/api/invitations/accept", { token }).expect(200);
    expect(res.body.lab.role).toBe("member");
    expect(await t.dataSource.getRepository(LabMembership).findOneBy({ labId: f.lab.id, userId: user.id })).toMatchObject({ role: "member" });
  });

  it("rejects an expired link with 410 and creates no account", async () => {
    const email = newcomer();
    const { created, token } = await invite(email);
    await t.dataSource.getRepository(Invitation).update({ id: created.invitation.id }, { expiresAt: new Date(Date.now() - 60_000) });
    const res = await new TestClient(t).post("/api/invitations/accept", { token, displayName: "Late", password: "late-but-long-enough" }).expect(410);
    expect(res.body.error.message).toMatch(/expired/);
    expect(await t.dataSource.getRepository(User).countBy({ email })).toBe(0);
    const list = InvitationListSchema.parse((await f.clients.owner.get(`/api/labs/${f.lab.id}/invitations`).expect(200)).body);
    expect(list.data.find((i) => i.id === created.invitation.id)?.status).toBe("expired");
  });

  it("withdraws an invitation (410 afterwards) and replaces an open one when inviting the same address again", async () => {
    const email = newcomer();
    const first = await invite(email);
    const second = await invite(email);
    const gone = await new TestClient(t).post("/api/invitations/preview", { token: first.token }).expect(410);
    expect(gone.body.error.message).toMatch(/withdrawn/);
    await f.clients.owner.delete(`/api/labs/${f.lab.id}/invitations/${second.created.invitation.id}`).expect(204);
    await new TestClient(t).post("/api/invitations/preview", { token: second.token }).expect(410);
    const list = InvitationListSchema.parse((await f.clients.owner.get(`/api/labs/${f.lab.id}/invitations`).expect(200)).body);
    expect(list.data.some((i) => i.email === email)).toBe(false);
  });

  it("refuses to invite someone who is already a member, naming the field", async () => {
    const res = await f.clients.owner.post(`/api/labs/${f.lab.id}/invitations`, { email: f.users.viewer.email, role: "member" }).expect(409);
    expect(res.body.error.details).toEqual([{ field: "email", message: expect.stringMatching(/already a member/) }]);
  });

  it("lets only owners invite; a bad role or address names the field", async () => {
    await f.clients.member.post(`/api/labs/${f.lab.id}/invitations`, { email: newcomer(), role: "viewer" }).expect(403);
    await f.clients.outsider.post(`/api/labs/${f.lab.id}/invitations`, { email: newcomer(), role: "viewer" }).expect(404);
    const bad = await f.clients.owner.post(`/api/labs/${f.lab.id}/invitations`, { email: "not-an-address", role: "admin" }).expect(400);
    expect(bad.body.error.details.map((d: { field: string }) => d.field).sort()).toEqual(["email", "role"]);
  });

  it("lets a link be used exactly once even when two people accept it at the same moment", async () => {
    const { token } = await invite(newcomer(), "viewer");
    const [x, y] = await Promise.all([
      new TestClient(t).post("/api/invitations/accept", { token, displayName: "First", password: "first-to-the-link" }),
      new TestClient(t).post("/api/invitations/accept", { token, displayName: "Second", password: "second-to-the-link" }),
    ]);
    expect([x.status, y.status].sort()).toEqual([200, 410]);
  });

  it("answers an unknown link with 404", async () => {
    const res = await new TestClient(t).post("/api/invitations/preview", { token: "y".repeat(43) }).expect(404);
    expect(res.body.error.message).toMatch(/not valid/);
  });
});
