import { createHash } from "node:crypto";
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from "vitest";
import { CreatedShareSchema, GuestShareListSchema, ShareListSchema, SharedViewSchema, type CreatedShare } from "@shared/schemas/shares";
import { AuditEntry, Share, User } from "../../server/entities/index";
import { TEST_PASSWORD, TestClient } from "../support/clients";
import { mailTo } from "../support/mail";
import { PRIVATE_NOTE, expectNoLeak, sharingLab, type SharingFixture } from "../support/sharingFixture";
import { startTestApp, type TestApp } from "../support/testApp";

/**
 * Share links and guest shares: a link opens exactly one item to whoever holds its token
 * (≥ 128 random bits, stored only as a SHA-256), until it expires or is revoked — then it
 * answers 410 saying so. A guest share opens the item to the signed-in account of the invited
 * address only. Nothing else of the lab travels with either.
 */
describe("shares", () => {
  let t: TestApp;
  let s: SharingFixture;
  let anonymous: TestClient;
  beforeAll(async () => {
    t = await startTestApp();
    s = await sharingLab(t);
    anonymous = new TestClient(t);
  });
  afterAll(() => t.close());
  afterEach(() => vi.useRealTimers());

  const share = async (body: object, client = s.f.clients.member): Promise<CreatedShare> => {
    const res = await client.post(`/api/labs/${s.lab}/shares`, body);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    return CreatedShareSchema.parse(res.body);
  };
  const open = (token: string) => anonymous.post("/api/shared/view", { token });
  const mleOf = (run: SharingFixture["runA"]) => run.reconstructions.find((r) => r.method === "mle")!;

  it("a reconstruction link: unguessable token stored only as its hash, opens that reconstruction and its counts only", async () => {
    const rec = mleOf(s.runA);
    const created = await share({ kind: "link", itemType: "reconstruction", itemId: rec.id, label: "for the referee" });
    const { token, url } = created.link!;
    // 32 random bytes in base64url: 256 bits, well above the 128 asked for.
    expect(Buffer.from(token, "base64url").length).toBeGreaterThanOrEqual(16);
    expect(url.endsWith(`/shared/${token}`)).toBe(true);
    const row = await t.dataSource.getRepository(Share).findOneByOrFail({ id: created.share.id });
    expect(row.tokenSha256).toBe(createHash("sha256").update(token).digest("hex"));
    expect(JSON.stringify(row)).not.toContain(token);
    expect(created.share).toMatchObject({ kind: "link", itemType: "reconstruction", itemId: rec.id, status: "active", label: "for the referee", createdBy: { id: s.f.users.member.id, displayName: "Member" } });

    const res = await open(token).expect(200);
    const view = SharedViewSchema.parse(res.body);
    expect(view.snapshot.itemType).toBe("reconstruction");
    expect(view.snapshot.runs).toHaveLength(1);
    const [run] = view.snapshot.runs;
    expect(run.rows).toEqual(s.runA.rows);
    expect(run.reconstructions.map((r) => r.id)).toEqual([rec.id]);
    expect(run.reconstructions[0].rho).toEqual(rec.rho);
    expect(run.reconstructions[0].metrics).toEqual(rec.metrics);
    expect(run.reconstructions[0].uncertainties).toEqual(rec.uncertainties);
    expect(run.reconstructions[0].corrections).toEqual(rec.corrections);
    expect(view.snapshot.setup.session.notes).toBeNull();
    const linear = s.runA.reconstructions.find((r) => r.method === "linear")!;
    expectNoLeak(res.body, [...s.labSecrets, linear.id, s.runB.id, s.runB.name]);
  });

  it("a run link shows the run with its reconstructions, not its sibling runs", async () => {
    const { link } = await share({ kind: "link", itemType: "run", itemId: s.runA.id });
    const res = await open(link!.token).expect(200);
    const view = SharedViewSchema.parse(res.body);
    expect(view.snapshot.title).toBe(s.runA.name);
    expect(view.snapshot.runs.map((r) => r.id)).toEqual([s.runA.id]);
    expect(view.snapshot.runs[0].reconstructions.map((r) => r.id).sort()).toEqual(s.runA.reconstructions.map((r) => r.id).sort());
    expect(view.snapshot.runs[0].notes).toBe(s.runA.notes);
    expectNoLeak(res.body, [...s.labSecrets, s.runB.id, s.runB.name]);
  });

  it("a session link shows the session's runs and setup, never its private notes or the lab's other sessions", async () => {
    const { link } = await share({ kind: "link", itemType: "session", itemId: s.sessionId });
    const res = await open(link!.token).expect(200);
    const view = SharedViewSchema.parse(res.body);
    expect(view.snapshot.runs.map((r) => r.id)).toEqual([s.runA.id, s.runB.id]);
    expect(view.snapshot.setup.session).toMatchObject({ title: "Shared session", coincidenceWindowNs: 3, notes: null });
    expectNoLeak(res.body, s.labSecrets);
    // Notes not marked private are part of the setup.
    await s.f.clients.member.patch(`/api/labs/${s.lab}/sessions/${s.sessionId}`, { notes: "Aligned at 09:00", notesPrivate: false }).expect(200);
    const again = SharedViewSchema.parse((await open(link!.token).expect(200)).body);
    expect(again.snapshot.setup.session.notes).toBe("Aligned at 09:00");
    await s.f.clients.member.patch(`/api/labs/${s.lab}/sessions/${s.sessionId}`, { notes: PRIVATE_NOTE, notesPrivate: true }).expect(200);
  });

  it("an unknown token is a 404; a link stops at its expiry with a 410 saying so", async () => {
    const unknown = await open("x".repeat(43)).expect(404);
    expect(unknown.body.error.code).toBe("not_found");
    const inOneHour = new Date(Date.now() + 3600_000);
    const { link, share: made } = await share({ kind: "link", itemType: "run", itemId: s.runA.id, expiresAt: inOneHour.toISOString() });
    expect(made.expiresAt).toBe(inOneHour.toISOString());
    await open(link!.token).expect(200);
    vi.useFakeTimers({ toFake: ["Date"] });
    vi.setSystemTime(new Date(inOneHour.getTime() + 60_000));
    const res = await open(link!.token).expect(410);
    expect(res.body.error.code).toBe("gone");
    expect(res.body.error.message).toMatch(/no longer valid: it expired on/);
    const list = ShareListSchema.parse((await s.f.clients.viewer.get(`/api/labs/${s.lab}/shares?itemType=run&itemId=${s.runA.id}`).expect(200)).body);
    expect(list.data.find((x) => x.id === made.id)?.status).toBe("expired");
  });

  it("rejects an expiry in the past or too far ahead, and a label PostgreSQL cannot store, naming the field", async () => {
    const past = await s.f.clients.member.post(`/api/labs/${s.lab}/shares`, { kind: "link", itemType: "run", itemId: s.runA.id, expiresAt: "2020-01-01T00:00:00Z" }).expect(400);
    expect(past.body.error.details).toEqual([{ field: "expiresAt", message: "The expiry must be in the future." }]);
    const nul = await s.f.clients.member.post(`/api/labs/${s.lab}/shares`, { kind: "link", itemType: "run", itemId: s.runA.id, label: "for\u0000you" }).expect(400);
    expect(nul.body.error.details[0].field).toBe("label");
    const far = await s.f.clients.member.post(`/api/labs/${s.lab}/shares`, { kind: "link", itemType: "run", itemId: s.runA.id, expiresAt: "2999-01-01T00:00:00Z" }).expect(400);
    expect(far.body.error.details[0].field).toBe("expiresAt");
  });

  it("revoking stops the link at once (410 naming the revocation); the list shows who made and who revoked it", async () => {
    const { link, share: made } = await share({ kind: "link", itemType: "session", itemId: s.sessionId });
    await open(link!.token).expect(200);
    await s.f.clients.viewer.post(`/api/labs/${s.lab}/shares/${made.id}/revoke`).expect(403);
    await open(link!.token).expect(200);
    const revoked = await s.f.clients.owner.post(`/api/labs/${s.lab}/shares/${made.id}/revoke`).expect(200);
    expect(revoked.body).toMatchObject({ status: "revoked", revokedBy: { id: s.f.users.owner.id, displayName: "Owner" }, createdBy: { id: s.f.users.member.id } });
    const res = await open(link!.token).expect(410);
    expect(res.body.error.message).toMatch(/no longer valid: the lab revoked it on/);
    // Revoking twice changes nothing and keeps the first revocation's author.
    const twice = await s.f.clients.member.post(`/api/labs/${s.lab}/shares/${made.id}/revoke`).expect(200);
    expect(twice.body.revokedBy.id).toBe(s.f.users.owner.id);
    const list = ShareListSchema.parse((await s.f.clients.viewer.get(`/api/labs/${s.lab}/shares?itemType=session&itemId=${s.sessionId}`).expect(200)).body);
    const entry = list.data.find((x) => x.id === made.id)!;
    expect(entry).toMatchObject({ status: "revoked", itemTitle: "Shared session", openCount: 2, createdBy: { displayName: "Member" }, revokedBy: { displayName: "Owner" } });
    expect(list.data.every((x) => x.itemType === "session")).toBe(true);
    expect(JSON.stringify(list)).not.toMatch(/tokenSha256|[0-9a-f]{64}/);
    const audit = await t.dataSource.getRepository(AuditEntry).findBy({ entityId: made.id });
    expect(audit.map((a) => a.action).sort()).toEqual(["share.create", "share.revoke"]);
  });

  it("cannot share another lab's item, and viewers cannot share at all", async () => {
    const theirs = await s.f.clients.outsider.post(`/api/labs/${s.f.otherLab.id}/sessions`, { sourceId: (await s.f.clients.outsider.post(`/api/labs/${s.f.otherLab.id}/sources`, { name: "Elsewhere source" }).expect(201)).body.id, title: "Theirs", date: "2026-01-01" }).expect(201);
    await s.f.clients.member.post(`/api/labs/${s.lab}/shares`, { kind: "link", itemType: "session", itemId: theirs.body.id }).expect(404);
    await s.f.clients.outsider.post(`/api/labs/${s.f.otherLab.id}/shares`, { kind: "link", itemType: "run", itemId: s.runA.id }).expect(404);
    await s.f.clients.viewer.post(`/api/labs/${s.lab}/shares`, { kind: "link", itemType: "run", itemId: s.runA.id }).expect(403);
    expect(await t.dataSource.getRepository(Share).countBy({ labId: s.f.otherLab.id })).toBe(0);
  });

  describe("guest shares", () => {
    const guestEmail = "collaborator@partner.example";
    let guest: TestClient;
    beforeAll(async () => {
      await t.dataSource.getRepository(User).save({ email: guestEmail, displayName: "Partner collaborator", passwordHash: (await t.dataSource.getRepository(User).findOneByOrFail({ id: s.f.users.owner.id })).passwordHash, emailVerifiedAt: new Date() });
      guest = new TestClient(t);
      await guest.signIn(guestEmail, TEST_PASSWORD);
    });

    it("invites by e-mail; the guest sees that one item and nothing else of the lab", async () => {
      const created = await share({ kind: "guest", itemType: "run", itemId: s.runA.id, email: "Collaborator@Partner.example", message: "Here is the 5 mW state." });
      expect(created.link).toBeNull();
      expect(created.mail).toEqual({ sent: true });
      expect(created.share).toMatchObject({ kind: "guest", email: guestEmail, status: "active" });
      const mail = await mailTo(guestEmail, /shared “Shared run 5 mW” with you/);
      expect(mail.text).toContain("Here is the 5 mW state.");
      expect(mail.links.some((l) => new URL(l).pathname === `/guest/${created.share.id}`)).toBe(true);

      const list = GuestShareListSchema.parse((await guest.get("/api/guest/shares").expect(200)).body);
      expect(list.data.map((x) => x.id)).toEqual([created.share.id]);
      expect(list.data[0]).toMatchObject({ itemType: "run", itemTitle: "Shared run 5 mW", sharedBy: "Member", status: "active" });
      const res = await guest.get(`/api/guest/shares/${created.share.id}`).expect(200);
      const view = SharedViewSchema.parse(res.body);
      expect(view.snapshot.runs.map((r) => r.id)).toEqual([s.runA.id]);
      expectNoLeak(res.body, [...s.labSecrets, s.runB.id]);
      // Being a guest of one item opens nothing else.
      await guest.get(`/api/labs/${s.lab}`).expect(404);
      await guest.get(`/api/labs/${s.lab}/runs/${s.runA.id}`).expect(404);
      await guest.get(`/api/labs/${s.lab}/shares`).expect(404);
    });

    it("opens only for the invited address; revoked, it answers 410", async () => {
      const created = await share({ kind: "guest", itemType: "session", itemId: s.sessionId, email: guestEmail });
      await s.f.clients.outsider.get(`/api/guest/shares/${created.share.id}`).expect(404);
      await s.f.clients.member.get(`/api/guest/shares/${created.share.id}`).expect(404);
      await anonymous.get(`/api/guest/shares/${created.share.id}`).expect(401);
      await guest.get(`/api/guest/shares/${created.share.id}`).expect(200);
      await s.f.clients.owner.post(`/api/labs/${s.lab}/shares/${created.share.id}/revoke`).expect(200);
      const res = await guest.get(`/api/guest/shares/${created.share.id}`).expect(410);
      expect(res.body.error.message).toMatch(/no longer valid: the lab revoked it/);
      const list = GuestShareListSchema.parse((await guest.get("/api/guest/shares").expect(200)).body);
      expect(list.data.find((x) => x.id === created.share.id)?.status).toBe("revoked");
    });

    it("refuses to invite a lab member as a guest, and a second open share of the same item to the same address", async () => {
      const member = await s.f.clients.owner.post(`/api/labs/${s.lab}/shares`, { kind: "guest", itemType: "run", itemId: s.runA.id, email: s.f.users.viewer.email }).expect(409);
      expect(member.body.error.details[0].field).toBe("email");
      await share({ kind: "guest", itemType: "run", itemId: s.runB.id, email: guestEmail });
      const again = await s.f.clients.owner.post(`/api/labs/${s.lab}/shares`, { kind: "guest", itemType: "run", itemId: s.runB.id, email: guestEmail }).expect(409);
      expect(again.body.error.details[0].field).toBe("email");
    });
  });
});
