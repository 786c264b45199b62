import { createHash } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { LIMITS } from "@shared/limits";
import { ApiTokenListSchema, CreatedApiTokenSchema, CurrentCredentialsSchema } from "@shared/schemas/apiTokens";
import { ApiToken } from "../../server/entities/ApiToken";
import { LabMembership } from "../../server/entities/LabMembership";
import { TestClient, labWithRoles, type LabFixture } from "../support/clients";
import { psiMinusRows, sessionIn } from "../support/notebook";
import { startTestApp, type TestApp } from "../support/testApp";

/** A client that authenticates with a personal API token only (no cookie, no CSRF token). */
function tokenClient(t: TestApp, secret: string): TestClient {
  const client = new TestClient(t).withoutCsrf();
  client.setHeader("Authorization", `Bearer ${secret}`);
  return client;
}

describe("personal API tokens", () => {
  let t: TestApp;
  let f: LabFixture;
  let sessionId: string;
  beforeAll(async () => {
    t = await startTestApp();
    f = await labWithRoles(t);
    ({ sessionId } = await sessionIn(f));
  });
  afterAll(() => t.close());

  const create = (client: TestClient, body: object) => client.post("/api/tokens", body);

  it("shows the secret once, stores only its SHA-256, and lists the token without it", async () => {
    const res = await create(f.clients.member, { name: "Acquisition PC", labId: f.lab.id }).expect(201);
    const created = CreatedApiTokenSchema.parse(res.body);
    expect(created.secret).toMatch(/^rhb_[A-Za-z0-9_-]{43}$/);
    expect(created.lab).toEqual({ id: f.lab.id, name: f.lab.name });
    expect(created.status).toBe("active");

    const stored = await t.dataSource.getRepository(ApiToken).findOneByOrFail({ id: created.id });
    expect(stored.secretSha256).toBe(createHash("sha256").update(created.secret).digest("hex"));
    expect(JSON.stringify(stored)).not.toContain(created.secret);

    const list = await f.clients.member.get("/api/tokens").expect(200);
    const { data } = ApiTokenListSchema.parse(list.body);
    expect(data.map((d) => d.id)).toContain(created.id);
    expect(JSON.stringify(list.body)).not.toContain(created.secret.slice(12));
    expect(JSON.stringify(list.body)).not.toContain(stored.secretSha256);
    // Other people never see someone else's tokens.
    const owners = await f.clients.owner.get("/api/tokens").expect(200);
    expect(owners.body.data.map((d: { id: string }) => d.id)).not.toContain(created.id);
  });

  it("lets only people who may write in the lab create one (viewers 403, outsiders 404)", async () => {
    const viewer = await create(f.clients.viewer, { name: "Viewer's token", labId: f.lab.id }).expect(403);
    expect(viewer.body.error.code).toBe("forbidden");
    await create(f.clients.outsider, { name: "Not my lab", labId: f.lab.id }).expect(404);
    await create(f.clients.anonymous, { name: "Anyone", labId: f.lab.id }).expect(401);
    const invalid = await create(f.clients.member, { name: " ", labId: f.lab.id }).expect(400);
    expect(invalid.body.error.details[0].field).toBe("name");
  });

  it("works without a browser session or CSRF token on the endpoints that accept tokens", async () => {
    const { secret } = (await create(f.clients.member, { name: "Posts runs", labId: f.lab.id }).expect(201)).body;
    const client = tokenClient(t, secret);
    const me = CurrentCredentialsSchema.parse((await client.get("/api/tokens/current").expect(200)).body);
    expect(me.user.id).toBe(f.users.member.id);
    expect(me.token?.lab.id).toBe(f.lab.id);
    const run = await client.post(`/api/labs/${f.lab.id}/sessions/${sessionId}/runs`, { settingSetId: "tomo16", name: "Posted with a token", rows: psiMinusRows(), reconstruction: { monteCarloSamples: 0 } }).expect(201);
    expect(run.body.createdBy.id).toBe(f.users.member.id);
    const used = await t.dataSource.getRepository(ApiToken).findOneByOrFail({ secretSha256: createHash("sha256").update(secret).digest("hex") });
    expect(used.lastUsedAt).not.toBeNull();
  });

  it("cannot reach other endpoints or other labs, even of the same person", async () => {
    const { secret } = (await create(f.clients.member, { name: "Scoped", labId: f.lab.id }).expect(201)).body;
    const client = tokenClient(t, secret);
    // A token cannot mint tokens or use browser-only endpoints.
    const minted = await client.post("/api/tokens", { name: "Child", labId: f.lab.id }).expect(403);
    expect(minted.body.error.message).toMatch(/API tokens cannot use this endpoint/);
    await client.get("/api/tokens").expect(403);
    // The member joins the other lab too; the token still only reaches its own.
    await t.dataSource.getRepository(LabMembership).save({ labId: f.otherLab.id, userId: f.users.member.id, role: "member" });
    const labs = await client.get("/api/labs").expect(200);
    expect(labs.body.data.map((l: { id: string }) => l.id)).toEqual([f.lab.id]);
    const other = await sessionIn({ ...f, lab: f.otherLab, clients: { ...f.clients, member: f.clients.member } });
    await client.post(`/api/labs/${f.otherLab.id}/sessions/${other.sessionId}/runs`, { settingSetId: "tomo16", name: "Wrong lab", rows: psiMinusRows(), reconstruction: { monteCarloSamples: 0 } }).expect(404);
  });

  it("stops working at once when revoked; unknown and expired tokens are refused with a reason", async () => {
    const created = (await create(f.clients.member, { name: "To revoke", labId: f.lab.id }).expect(201)).body;
    const client = tokenClient(t, created.secret);
    await client.get("/api/tokens/current").expect(200);
    await f.clients.outsider.delete(`/api/tokens/${created.id}`).expect(404);
    const revoked = await f.clients.member.delete(`/api/tokens/${created.id}`).expect(200);
    expect(revoked.body.status).toBe("revoked");
    const refused = await client.get("/api/tokens/current").expect(401);
    expect(refused.body.error).toMatchObject({ code: "token_invalid", message: expect.stringContaining("was revoked") });

    const unknown = await tokenClient(t, "rhb_not-a-real-token").get("/api/tokens/current").expect(401);
    expect(unknown.body.error.message).toContain("is not known");

    const expiring = (await create(f.clients.member, { name: "Short-lived", labId: f.lab.id, expiresInDays: 1 }).expect(201)).body;
    await t.dataSource.getRepository(ApiToken).update({ id: expiring.id }, { expiresAt: new Date(Date.now() - 1000) });
    const expired = await tokenClient(t, expiring.secret).get("/api/tokens/current").expect(401);
    expect(expired.body.error.message).toContain("has expired");
  });

  it("never falls back to the browser session when a Bearer token is sent", async () => {
    f.clients.member.setHeader("Authorization", "Bearer rhb_bogus");
    try {
      await f.clients.member.get("/api/auth/me").expect(401);
    } finally {
      f.clients.member.setHeader("Authorization", "");
    }
  });

  it(`is rate-limited to ${LIMITS.apiTokenRequestsPerMinute} requests per token and minute`, async () => {
    const { secret } = (await create(f.clients.member, { name: "Chatty script", labId: f.lab.id }).expect(201)).body;
    const client = tokenClient(t, secret);
    for (let i = 0; i < LIMITS.apiTokenRequestsPerMinute; i++) await client.get("/api/tokens/current").expect(200);
    const limited = await client.get("/api/tokens/current").expect(429);
    expect(limited.body.error.code).toBe("rate_limited");
    expect(limited.headers["ratelimit-policy"]).toBeDefined();
    // Another token is counted on its own.
    const other = (await create(f.clients.member, { name: "Quiet script", labId: f.lab.id }).expect(201)).body;
    await tokenClient(t, other.secret).get("/api/tokens/current").expect(200);
  }, 60_000);
});
