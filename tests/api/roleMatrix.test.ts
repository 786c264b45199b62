/**
 * THE ROLE MATRIX: every API route, called by five people, with the status each must get.
 *
 *   anonymous — not signed in                      → 401 on anything that needs sign-in
 *   outsider  — signed in, owner of ANOTHER lab    → 404 on this lab's things (ids reveal nothing)
 *   viewer / member / owner — roles in this lab    → 403 where the role is not enough, else 2xx
 *
 * HOW TO ADD A ROW (every route declared with ApiRouter needs one; the test "has a row for every
 * registered endpoint" fails and lists the missing keys until it has):
 *   1. Add an entry to ROWS under the key "METHOD /api/path/:param", exactly as the route is
 *      registered (e.g. "POST /api/labs/:labId/sources").
 *   2. `expect`: a preset — PUBLIC(s), SIGNED_IN(s), LAB_READ(s), LAB_WRITE(s), LAB_MANAGE(s),
 *      where s is the success status — or spell out { anonymous, outsider, viewer, member, owner }.
 *   3. `request(ctx, caller)`: returns { path, body? } for a VALID request (so a 2xx really is
 *      possible and a 401/403/404 comes from authorisation, not from validation). It runs once per
 *      caller, right before that caller's call, so a destructive request (DELETE, accept) creates
 *      its own fresh target — use ctx.source(), ctx.labSession(), ctx.addViewer(), ctx.invite()
 *      or add a helper of the same kind below. Callers go in the order anonymous, outsider,
 *      viewer, member, owner; each row gets a fresh lab, so sign-out or deletion stays in the row.
 * For a list route, also make sure "lists never include another lab's rows" covers it (it does
 * automatically for every GET /api/labs/:labId/... route without further path parameters).
 */
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { endpointRegistry } from "../../server/http/endpoint";
import { ApiToken } from "../../server/entities/ApiToken";
import { Batch } from "../../server/entities/Batch";
import { EmailToken } from "../../server/entities/EmailToken";
import { Invitation } from "../../server/entities/Invitation";
import { LabMembership } from "../../server/entities/LabMembership";
import { Share } from "../../server/entities/Share";
import { User } from "../../server/entities/User";
import { newLinkToken } from "../../server/services/linkTokens";
import { TEST_PASSWORD, createUser, labWithRoles, type LabFixture, type TestClient } from "../support/clients";
import { psiMinusCsv, psiMinusRows } from "../support/notebook";
import { STANDARD_BELL_ANGLES, bellTestSettings, fringeScanSettings } from "@shared/physics/bell";
import { startTestApp, type TestApp } from "../support/testApp";

const CALLERS = ["anonymous", "outsider", "viewer", "member", "owner"] as const;
type Caller = (typeof CALLERS)[number];
type Expected = Record<Caller, number>;

const PUBLIC = (ok = 200): Expected => ({ anonymous: ok, outsider: ok, viewer: ok, member: ok, owner: ok });
const SIGNED_IN = (ok = 200): Expected => ({ anonymous: 401, outsider: ok, viewer: ok, member: ok, owner: ok });
const LAB_READ = (ok = 200): Expected => ({ anonymous: 401, outsider: 404, viewer: ok, member: ok, owner: ok });
const LAB_WRITE = (ok = 200): Expected => ({ anonymous: 401, outsider: 404, viewer: 403, member: ok, owner: ok });
const LAB_MANAGE = (ok = 200): Expected => ({ anonymous: 401, outsider: 404, viewer: 403, member: 403, owner: ok });

interface Ctx {
  t: TestApp;
  f: LabFixture;
  lab: string;
  /** A source in the lab (created once per row). */
  source(): Promise<string>;
  /** A lab session in the lab (created once per row). */
  labSession(): Promise<string>;
  /** A tomography run in that session, without Monte Carlo (created once per row). */
  run(): Promise<{ id: string; rows: object[]; reconstructionId: string }>;
  /** A second run in the same session, for comparisons (created once per row). */
  secondRun(): Promise<{ id: string; rows: object[]; reconstructionId: string }>;
  /** The attachment of a run uploaded as a counts file (created once per row). */
  attachment(): Promise<string>;
  /** A Bell-test or fringe-scan run in that session, given as waveplate angles (created once per row). */
  analysisRun(kind: "bell" | "fringe"): Promise<string>;
  /** A new viewer of the lab, e.g. someone to remove. */
  addViewer(): Promise<User>;
  /** An open invitation into the lab; returns its id and the link's token. */
  invite(): Promise<{ id: string; token: string }>;
  /** A user with a one-time e-mail link of the given purpose. */
  emailLink(purpose: "verify-email" | "reset-password"): Promise<string>;
  /** A fresh link share of the lab session; returns its id and the link's token. */
  linkShare(): Promise<{ id: string; token: string }>;
  /** A fresh guest share of the lab session for `email`; returns its id. */
  guestShare(email: string): Promise<string>;
  /** The lab session exported as a session bundle (parsed JSON). */
  bundle(): Promise<object>;
}

/** `file`: send multipart/form-data with this file in the field "file" (and `body` as text fields). */
interface RowRequest {
  path: string;
  body?: object;
  file?: { name: string; content: string };
}

interface Row {
  expect: Expected;
  request: (ctx: Ctx, caller: Caller) => Promise<RowRequest> | RowRequest;
}

const fresh = (tag: string) => `${tag}-${randomUUID().slice(0, 8)}@matrix.example`;
const unique = (name: string) => `${name} ${randomUUID().slice(0, 6)}`;
const today = new Date().toISOString().slice(0, 10);

const ROWS: Record<string, Row> = {
  // Meta and development
  "GET /api/openapi.json": { expect: PUBLIC(), request: () => ({ path: "/api/openapi.json" }) },
  "GET /api/dev/outbox": { expect: PUBLIC(), request: () => ({ path: "/api/dev/outbox" }) },

  // Accounts: public routes answer everybody alike
  "GET /api/auth/csrf-token": { expect: PUBLIC(), request: () => ({ path: "/api/auth/csrf-token" }) },
  "POST /api/auth/sign-up": { expect: PUBLIC(201), request: () => ({ path: "/api/auth/sign-up", body: { email: fresh("signup"), displayName: "New person", password: "matrix-password-ok" } }) },
  "POST /api/auth/verify-email": { expect: PUBLIC(), request: async (c) => ({ path: "/api/auth/verify-email", body: { token: await c.emailLink("verify-email") } }) },
  "POST /api/auth/resend-verification": { expect: PUBLIC(202), request: () => ({ path: "/api/auth/resend-verification", body: { email: fresh("resend") } }) },
  "POST /api/auth/sign-in": { expect: PUBLIC(), request: async (c) => ({ path: "/api/auth/sign-in", body: { email: (await createUser(c.t, "Signs in")).email, password: TEST_PASSWORD } }) },
  "POST /api/auth/sign-out": { expect: PUBLIC(204), request: () => ({ path: "/api/auth/sign-out" }) },
  "POST /api/auth/password-reset": { expect: PUBLIC(202), request: () => ({ path: "/api/auth/password-reset", body: { email: fresh("reset") } }) },
  "POST /api/auth/password-reset/confirm": { expect: PUBLIC(), request: async (c) => ({ path: "/api/auth/password-reset/confirm", body: { token: await c.emailLink("reset-password"), password: "a-new-matrix-password" } }) },
  "GET /api/auth/me": { expect: SIGNED_IN(), request: () => ({ path: "/api/auth/me" }) },
  "PATCH /api/account": { expect: SIGNED_IN(), request: () => ({ path: "/api/account", body: { displayName: "Renamed" } }) },
  "POST /api/account/password": { expect: SIGNED_IN(204), request: () => ({ path: "/api/account/password", body: { currentPassword: TEST_PASSWORD, newPassword: "changed-matrix-password" } }) },

  // Labs
  "GET /api/labs": { expect: SIGNED_IN(), request: () => ({ path: "/api/labs" }) },
  "POST /api/labs": { expect: SIGNED_IN(201), request: () => ({ path: "/api/labs", body: { name: "Another lab" } }) },
  "GET /api/labs/:labId": { expect: LAB_READ(), request: (c) => ({ path: `/api/labs/${c.lab}` }) },
  "PATCH /api/labs/:labId": { expect: LAB_MANAGE(), request: (c) => ({ path: `/api/labs/${c.lab}`, body: { name: "Renamed lab" } }) },
  "DELETE /api/labs/:labId": { expect: LAB_MANAGE(204), request: (c) => ({ path: `/api/labs/${c.lab}` }) },

  // Members: everyone in the lab sees them; owners change roles and remove people
  "GET /api/labs/:labId/members": { expect: LAB_READ(), request: (c) => ({ path: `/api/labs/${c.lab}/members` }) },
  "PATCH /api/labs/:labId/members/:userId": { expect: LAB_MANAGE(), request: async (c) => ({ path: `/api/labs/${c.lab}/members/${(await c.addViewer()).id}`, body: { role: "member" } }) },
  "DELETE /api/labs/:labId/members/:userId": { expect: LAB_MANAGE(204), request: async (c) => ({ path: `/api/labs/${c.lab}/members/${(await c.addViewer()).id}` }) },

  // Invitations: owners only; the person invited needs only the link
  "GET /api/labs/:labId/invitations": { expect: LAB_MANAGE(), request: (c) => ({ path: `/api/labs/${c.lab}/invitations` }) },
  "POST /api/labs/:labId/invitations": { expect: LAB_MANAGE(201), request: (c) => ({ path: `/api/labs/${c.lab}/invitations`, body: { email: fresh("invitee"), role: "viewer" } }) },
  "DELETE /api/labs/:labId/invitations/:invitationId": { expect: LAB_MANAGE(204), request: async (c) => ({ path: `/api/labs/${c.lab}/invitations/${(await c.invite()).id}` }) },
  "POST /api/invitations/preview": { expect: PUBLIC(), request: async (c) => ({ path: "/api/invitations/preview", body: { token: (await c.invite()).token } }) },
  // Anonymous callers sign up through the link; the outsider joins; people already in the lab get 409.
  "POST /api/invitations/accept": {
    expect: { anonymous: 200, outsider: 200, viewer: 409, member: 409, owner: 409 },
    request: async (c) => ({ path: "/api/invitations/accept", body: { token: (await c.invite()).token, displayName: "Invited person", password: "invited-matrix-password" } }),
  },

  // Notebook: sources and lab sessions
  "GET /api/labs/:labId/sources": { expect: LAB_READ(), request: (c) => ({ path: `/api/labs/${c.lab}/sources` }) },
  "POST /api/labs/:labId/sources": { expect: LAB_WRITE(201), request: (c) => ({ path: `/api/labs/${c.lab}/sources`, body: { name: unique("Sagnac source") } }) },
  "GET /api/labs/:labId/sources/:sourceId": { expect: LAB_READ(), request: async (c) => ({ path: `/api/labs/${c.lab}/sources/${await c.source()}` }) },
  "PATCH /api/labs/:labId/sources/:sourceId": { expect: LAB_WRITE(), request: async (c) => ({ path: `/api/labs/${c.lab}/sources/${await c.source()}`, body: { name: unique("Renamed source") } }) },
  "GET /api/labs/:labId/sessions": { expect: LAB_READ(), request: (c) => ({ path: `/api/labs/${c.lab}/sessions` }) },
  "POST /api/labs/:labId/sessions": { expect: LAB_WRITE(201), request: async (c) => ({ path: `/api/labs/${c.lab}/sessions`, body: { sourceId: await c.source(), title: "Alignment", date: today } }) },
  "GET /api/labs/:labId/sessions/:sessionId": { expect: LAB_READ(), request: async (c) => ({ path: `/api/labs/${c.lab}/sessions/${await c.labSession()}` }) },
  "PATCH /api/labs/:labId/sessions/:sessionId": { expect: LAB_WRITE(), request: async (c) => ({ path: `/api/labs/${c.lab}/sessions/${await c.labSession()}`, body: { title: "Renamed session" } }) },

  // Notebook: runs, reconstructions, comparisons, lab home
  "GET /api/labs/:labId/home": { expect: LAB_READ(), request: (c) => ({ path: `/api/labs/${c.lab}/home` }) },
  "GET /api/labs/:labId/runs": { expect: LAB_READ(), request: (c) => ({ path: `/api/labs/${c.lab}/runs` }) },
  "POST /api/labs/:labId/sessions/:sessionId/runs": {
    expect: LAB_WRITE(201),
    request: async (c) => ({ path: `/api/labs/${c.lab}/sessions/${await c.labSession()}/runs`, body: { settingSetId: "tomo16", name: "Matrix run", rows: psiMinusRows(), reconstruction: { monteCarloSamples: 0 } } }),
  },
  "POST /api/labs/:labId/sessions/:sessionId/runs/upload": {
    expect: LAB_WRITE(201),
    request: async (c) => ({ path: `/api/labs/${c.lab}/sessions/${await c.labSession()}/runs/upload`, file: { name: "matrix.csv", content: psiMinusCsv() } }),
  },
  "GET /api/labs/:labId/attachments/:attachmentId": { expect: LAB_READ(), request: async (c) => ({ path: `/api/labs/${c.lab}/attachments/${await c.attachment()}` }) },
  "GET /api/labs/:labId/runs/:runId": { expect: LAB_READ(), request: async (c) => ({ path: `/api/labs/${c.lab}/runs/${(await c.run()).id}` }) },
  "PATCH /api/labs/:labId/runs/:runId": { expect: LAB_WRITE(), request: async (c) => ({ path: `/api/labs/${c.lab}/runs/${(await c.run()).id}`, body: { notes: "Checked" } }) },
  "POST /api/labs/:labId/runs/:runId/revisions": {
    expect: LAB_WRITE(201),
    request: async (c) => ({ path: `/api/labs/${c.lab}/runs/${(await c.run()).id}/revisions`, body: { reason: "Matrix correction", rows: (await c.run()).rows, reconstruction: { monteCarloSamples: 0 } } }),
  },
  "POST /api/labs/:labId/runs/:runId/reconstructions": {
    expect: LAB_WRITE(201),
    request: async (c) => ({ path: `/api/labs/${c.lab}/runs/${(await c.run()).id}/reconstructions`, body: { method: "linear", monteCarloSamples: 0, corrections: { accidentals: true } } }),
  },
  "GET /api/labs/:labId/reconstructions/:reconstructionId": { expect: LAB_READ(), request: async (c) => ({ path: `/api/labs/${c.lab}/reconstructions/${(await c.run()).reconstructionId}` }) },
  "GET /api/labs/:labId/compare": { expect: LAB_READ(), request: async (c) => ({ path: `/api/labs/${c.lab}/compare?runs=${(await c.run()).id},${(await c.secondRun()).id}` }) },

  // Bell tests, fringe scans and trends (read-only analyses)
  "GET /api/labs/:labId/runs/:runId/bell-test": { expect: LAB_READ(), request: async (c) => ({ path: `/api/labs/${c.lab}/runs/${await c.analysisRun("bell")}/bell-test` }) },
  "GET /api/labs/:labId/runs/:runId/fringe-fit": { expect: LAB_READ(), request: async (c) => ({ path: `/api/labs/${c.lab}/runs/${await c.analysisRun("fringe")}/fringe-fit` }) },
  "GET /api/labs/:labId/trends": { expect: LAB_READ(), request: async (c) => ({ path: `/api/labs/${c.lab}/trends?sessionId=${await c.labSession()}` }) },

  // Personal API tokens: anyone signed in manages their own; creating one needs write access to its lab
  "GET /api/tokens": { expect: SIGNED_IN(), request: () => ({ path: "/api/tokens" }) },
  "GET /api/tokens/current": { expect: SIGNED_IN(), request: () => ({ path: "/api/tokens/current" }) },
  "POST /api/tokens": { expect: LAB_WRITE(201), request: (c) => ({ path: "/api/tokens", body: { name: "Matrix token", labId: c.lab } }) },
  "POST /api/labs/:labId/sessions/:sessionId/batches": {
    expect: LAB_WRITE(202),
    request: async (c) => ({ path: `/api/labs/${c.lab}/sessions/${await c.labSession()}/batches`, file: { name: "matrix.csv", content: psiMinusCsv() } }),
  },
  "GET /api/labs/:labId/batches": { expect: LAB_READ(), request: (c) => ({ path: `/api/labs/${c.lab}/batches` }) },
  "GET /api/labs/:labId/batches/:batchId": {
    expect: LAB_READ(),
    request: async (c) => {
      const batch = await c.t.dataSource.getRepository(Batch).save({ labId: c.lab, sessionId: await c.labSession(), origin: "browser", tokenId: null, fileCount: 1, createdById: c.f.users.owner.id });
      return { path: `/api/labs/${c.lab}/batches/${batch.id}` };
    },
  },
  // Each caller posts a different run: a repeat of the same one would (rightly) answer 200 "duplicate".
  "POST /api/labs/:labId/sessions/:sessionId/acquisitions": {
    expect: LAB_WRITE(201),
    request: async (c, caller) => ({ path: `/api/labs/${c.lab}/sessions/${await c.labSession()}/acquisitions`, body: { name: `Acquired by ${caller}`, settingSetId: "tomo16", rows: psiMinusRows({ seed: 40 + caller.length }), reconstruction: { monteCarloSamples: 0 } } }),
  },
  // Everyone revokes only their own token: the outsider (and anonymous) aim at the owner's.
  "DELETE /api/tokens/:tokenId": {
    expect: { anonymous: 401, outsider: 404, viewer: 200, member: 200, owner: 200 },
    request: async (c, caller) => {
      const userId = (caller === "viewer" || caller === "member" ? c.f.users[caller] : c.f.users.owner).id;
      const token = await c.t.dataSource.getRepository(ApiToken).save({ userId, labId: c.lab, name: "Matrix token", secretSha256: randomUUID().replace(/-/g, "").padEnd(64, "0"), hint: "rhb_matrix" });
      return { path: `/api/tokens/${token.id}` };
    },
  },

  // Shares, exports and session bundles: everyone in the lab lists and exports; members share, revoke and import
  "GET /api/labs/:labId/shares": { expect: LAB_READ(), request: (c) => ({ path: `/api/labs/${c.lab}/shares` }) },
  "POST /api/labs/:labId/shares": { expect: LAB_WRITE(201), request: async (c) => ({ path: `/api/labs/${c.lab}/shares`, body: { kind: "link", itemType: "session", itemId: await c.labSession() } }) },
  "POST /api/labs/:labId/shares/:shareId/revoke": { expect: LAB_WRITE(), request: async (c) => ({ path: `/api/labs/${c.lab}/shares/${(await c.linkShare()).id}/revoke` }) },
  // A link opens for whoever holds it; a guest share for the signed-in account of the address it names.
  "POST /api/shared/view": { expect: PUBLIC(), request: async (c) => ({ path: "/api/shared/view", body: { token: (await c.linkShare()).token } }) },
  "GET /api/guest/shares": { expect: SIGNED_IN(), request: () => ({ path: "/api/guest/shares" }) },
  "GET /api/guest/shares/:shareId": { expect: SIGNED_IN(), request: async (c, caller) => ({ path: `/api/guest/shares/${await c.guestShare(caller === "anonymous" ? fresh("guest") : c.f.users[caller].email)}` }) },
  "GET /api/labs/:labId/runs/:runId/counts.csv": { expect: LAB_READ(), request: async (c) => ({ path: `/api/labs/${c.lab}/runs/${(await c.run()).id}/counts.csv` }) },
  "GET /api/labs/:labId/reconstructions/:reconstructionId/export/:file": { expect: LAB_READ(), request: async (c) => ({ path: `/api/labs/${c.lab}/reconstructions/${(await c.run()).reconstructionId}/export/rho.json` }) },
  "GET /api/labs/:labId/sessions/:sessionId/export/:file": { expect: LAB_READ(), request: async (c) => ({ path: `/api/labs/${c.lab}/sessions/${await c.labSession()}/export/metrics.csv` }) },
  "GET /api/labs/:labId/reports/:itemType/:itemId": { expect: LAB_READ(), request: async (c) => ({ path: `/api/labs/${c.lab}/reports/run/${(await c.run()).id}` }) },
  "GET /api/labs/:labId/sessions/:sessionId/bundle": { expect: LAB_READ(), request: async (c) => ({ path: `/api/labs/${c.lab}/sessions/${await c.labSession()}/bundle` }) },
  "POST /api/labs/:labId/bundles": { expect: LAB_WRITE(201), request: async (c) => ({ path: `/api/labs/${c.lab}/bundles`, body: { bundle: await c.bundle() } }) },
};

function once<T>(make: () => Promise<T>): () => Promise<T> {
  let p: Promise<T> | undefined;
  return () => (p ??= make());
}

function makeCtx(t: TestApp, f: LabFixture): Ctx {
  const lab = f.lab.id;
  const owner = f.clients.owner;
  const created = async (res: { status: number; body: { id?: string } }, what: string) => {
    if (res.status !== 201 || !res.body.id) throw new Error(`setting up ${what} failed: ${res.status} ${JSON.stringify(res.body)}`);
    return res.body.id;
  };
  const source = once(async () => created(await owner.post(`/api/labs/${lab}/sources`, { name: unique("Matrix source") }), "a source"));
  const labSession = once(async () => created(await owner.post(`/api/labs/${lab}/sessions`, { sourceId: await source(), title: unique("Matrix session"), date: today, coincidenceWindowNs: 3 }), "a lab session"));
  const newRun = async (seed: number) => {
    const res = await owner.post(`/api/labs/${lab}/sessions/${await labSession()}/runs`, { settingSetId: "tomo16", name: unique("Matrix run"), rows: psiMinusRows({ seed }), reconstruction: { monteCarloSamples: 0 } });
    return { id: await created(res, "a run"), rows: res.body.rows, reconstructionId: res.body.reconstructions[0].id };
  };
  const run = once(() => newRun(1));
  const secondRun = once(() => newRun(2));
  const attachment = once(async () => {
    const res = await owner.post(`/api/labs/${lab}/sessions/${await labSession()}/runs/upload`).attach("file", Buffer.from(psiMinusCsv({ seed: 3 })), "matrix.csv");
    await created(res, "an uploaded run");
    return res.body.attachments[0].id as string;
  });
  const analysisRun = async (kind: "bell" | "fringe") => {
    const settings = kind === "bell" ? bellTestSettings(STANDARD_BELL_ANGLES) : fringeScanSettings(0, [0, 45, 90, 135]);
    const rows = settings.map((setting, i) => ({ setting, counts: 100 + 37 * (i % 4) }));
    return created(await owner.post(`/api/labs/${lab}/sessions/${await labSession()}/runs`, { kind, settingSetId: "custom", name: unique(`Matrix ${kind} run`), rows }), `a ${kind} run`);
  };
  return {
    t,
    f,
    lab,
    source,
    labSession,
    run,
    secondRun,
    attachment,
    analysisRun,
    async addViewer() {
      const user = await createUser(t, "Extra viewer");
      await t.dataSource.getRepository(LabMembership).save({ labId: lab, userId: user.id, role: "viewer" });
      return user;
    },
    async invite() {
      const { token, sha256 } = newLinkToken();
      const inv = await t.dataSource.getRepository(Invitation).save({ labId: lab, email: fresh("invited"), role: "viewer", tokenSha256: sha256, invitedById: f.users.owner.id, expiresAt: new Date(Date.now() + 86_400_000) });
      return { id: inv.id, token };
    },
    async emailLink(purpose) {
      const user = await t.dataSource.getRepository(User).save({ email: fresh("linked"), displayName: "Linked", passwordHash: "x", emailVerifiedAt: null });
      const { token, sha256 } = newLinkToken();
      await t.dataSource.getRepository(EmailToken).save({ userId: user.id, purpose, tokenSha256: sha256, expiresAt: new Date(Date.now() + 3_600_000), usedAt: null });
      return token;
    },
    async linkShare() {
      const { token, sha256 } = newLinkToken();
      const share = await t.dataSource.getRepository(Share).save({ labId: lab, kind: "link", itemType: "session", sessionId: await labSession(), tokenSha256: sha256, createdById: f.users.owner.id });
      return { id: share.id, token };
    },
    async guestShare(email) {
      const share = await t.dataSource.getRepository(Share).save({ labId: lab, kind: "guest", itemType: "session", sessionId: await labSession(), email: email.toLowerCase(), createdById: f.users.owner.id });
      return share.id;
    },
    async bundle() {
      const res = await owner.get(`/api/labs/${lab}/sessions/${await labSession()}/bundle`);
      if (res.status !== 200) throw new Error(`exporting a bundle failed: ${res.status} ${res.text}`);
      return JSON.parse(res.text);
    },
  };
}

function call(client: TestClient, method: string, path: string, body?: object) {
  switch (method) {
    case "GET":
      return client.get(path);
    case "POST":
      return client.post(path, body);
    case "PUT":
      return client.put(path, body);
    case "PATCH":
      return client.patch(path, body);
    case "DELETE":
      return client.delete(path);
    default:
      throw new Error(`no test call for method ${method}`);
  }
}

const keyOf = (e: { method: string; path: string }) => `${e.method.toUpperCase()} ${e.path}`;

describe("role matrix: every route × anonymous, outsider, viewer, member, owner", () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  it("has a row for every registered endpoint, and no row for a route that does not exist", () => {
    const registered = endpointRegistry.map(keyOf);
    const missing = registered.filter((k) => !(k in ROWS));
    const stale = Object.keys(ROWS).filter((k) => !registered.includes(k));
    expect(missing, `add these routes to ROWS in tests/api/roleMatrix.test.ts (see the top of the file)`).toEqual([]);
    expect(stale, "these rows name routes that are not registered").toEqual([]);
  });

  for (const [key, row] of Object.entries(ROWS)) {
    it(key, async () => {
      const [method] = key.split(" ");
      const f = await labWithRoles(t);
      const ctx = makeCtx(t, f);
      const got: Partial<Expected> = {};
      const bodies: Partial<Record<Caller, unknown>> = {};
      for (const caller of CALLERS) {
        const { path, body, file } = await row.request(ctx, caller);
        const res = file ? await f.clients[caller].post(path).attach("file", Buffer.from(file.content), file.name) : await call(f.clients[caller], method, path, body);
        got[caller] = res.status;
        bodies[caller] = res.body;
      }
      expect(got, JSON.stringify(bodies)).toEqual(row.expect);
    });
  }
});

describe("another lab's rows stay invisible", () => {
  let t: TestApp;
  let f: LabFixture;
  let secrets: string[];
  beforeAll(async () => {
    t = await startTestApp();
    f = await labWithRoles(t);
    const ctx = makeCtx(t, f);
    secrets = [f.lab.id, await ctx.source(), await ctx.labSession(), f.users.viewer.id, f.users.member.id, f.users.owner.id, f.lab.name];
    // The outsider's own lab has rows of its own, so the lists below are not trivially empty.
    await f.clients.outsider.post(`/api/labs/${f.otherLab.id}/sources`, { name: "Outsider source" }).expect(201);
  });
  afterAll(() => t.close());

  it("lists never include another lab's rows (every GET list route under /api/labs/:labId)", async () => {
    const lists = endpointRegistry.filter((e) => e.method === "get" && /^\/api\/labs\/:labId(\/[a-z-]+)*$/.test(e.path) && e.path !== "/api/labs/:labId");
    expect(lists.length).toBeGreaterThan(0);
    for (const e of lists) {
      const res = await f.clients.outsider.get(e.path.replace(":labId", f.otherLab.id));
      expect([200, 403], `${e.path}: ${JSON.stringify(res.body)}`).toContain(res.status);
      const text = JSON.stringify(res.body);
      for (const s of secrets) expect(text, `${e.path} leaks ${s}`).not.toContain(s);
    }
    const labs = await f.clients.outsider.get("/api/labs").expect(200);
    expect(labs.body.data.map((l: { id: string }) => l.id)).toEqual([f.otherLab.id]);
    const sources = await f.clients.outsider.get(`/api/labs/${f.otherLab.id}/sources`).expect(200);
    expect(sources.body.data.map((s: { name: string }) => s.name)).toEqual(["Outsider source"]);
  });

  it("guessing ids reveals nothing: a real id of another lab and a random id get the same 404", async () => {
    const ctx = makeCtx(t, f);
    const real = await f.clients.outsider.get(`/api/labs/${f.lab.id}/sources/${await ctx.source()}`).expect(404);
    const random = await f.clients.outsider.get(`/api/labs/${randomUUID()}/sources/${randomUUID()}`).expect(404);
    expect(real.body).toEqual(random.body);
    const realLab = await f.clients.outsider.get(`/api/labs/${f.lab.id}`).expect(404);
    const randomLab = await f.clients.outsider.get(`/api/labs/${randomUUID()}`).expect(404);
    expect(realLab.body).toEqual(randomLab.body);
  });
});
