import { randomUUID } from "node:crypto";
import bcrypt from "bcryptjs";
import request from "supertest";
import type { LabRole } from "@shared/schemas/roles";
import { Lab, LabMembership, User } from "../../server/entities/index";
import type { TestApp } from "./testApp";

export const TEST_PASSWORD = "correct-horse-battery-staple";
const TEST_HASH = bcrypt.hashSync(TEST_PASSWORD, 4);

type WriteMethod = "post" | "put" | "patch" | "delete";

/**
 * A browser-like API client for tests: keeps the sign-in cookie and, like the web client, sends
 * the session's CSRF token (X-CSRF-Token) with every POST/PUT/PATCH/DELETE — fetched on the first
 * write and followed through sign-in and sign-out, which send a fresh one in the response header.
 * Use it instead of bare supertest for API tests; `withoutCsrf()` is for testing the protection.
 */
export class TestClient {
  readonly agent: ReturnType<typeof request.agent>;
  private extraHeaders: Record<string, string> = {};
  private csrfToken: string | undefined;
  private sendCsrf = true;

  constructor(readonly t: TestApp) {
    this.agent = request.agent(t.app);
  }

  setHeader(name: string, value: string): void {
    this.extraHeaders[name] = value;
  }

  /** From now on, writes go out without the CSRF header (as a forged cross-site request would). */
  withoutCsrf(): this {
    this.sendCsrf = false;
    return this;
  }

  get(path: string): request.Test {
    return this.follow(this.agent.get(path).set(this.extraHeaders));
  }
  post(path: string, body?: object): request.Test {
    return this.write("post", path, body);
  }
  put(path: string, body?: object): request.Test {
    return this.write("put", path, body);
  }
  patch(path: string, body?: object): request.Test {
    return this.write("patch", path, body);
  }
  delete(path: string): request.Test {
    return this.write("delete", path);
  }

  /** The session's CSRF token, fetched once and then kept up to date from response headers. */
  async csrf(): Promise<string> {
    if (!this.csrfToken) {
      const res = await this.agent.get("/api/auth/csrf-token");
      if (res.status !== 200) throw new Error(`could not get a CSRF token: ${res.status} ${JSON.stringify(res.body)}`);
      this.csrfToken = res.body.token;
    }
    return this.csrfToken!;
  }

  async signIn(email: string, password = TEST_PASSWORD): Promise<void> {
    const res = await this.post("/api/auth/sign-in", { email, password });
    if (res.status !== 200) throw new Error(`sign-in of ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  }

  private write(method: WriteMethod, path: string, body?: object): request.Test {
    return deferred(async () => {
      // The token first: the agent attaches its cookies when the request is created.
      const token = this.sendCsrf ? await this.csrf() : undefined;
      const r = this.agent[method](path).set(this.extraHeaders);
      if (token) r.set("X-CSRF-Token", token);
      if (body !== undefined) r.send(body);
      return { real: this.follow(r) };
    });
  }

  private follow(r: request.Test): request.Test {
    r.on("response", (res: { headers: Record<string, string | undefined> }) => {
      const token = res.headers["x-csrf-token"];
      if (token) this.csrfToken = token;
    });
    return r;
  }
}

/**
 * A supertest request that can only be built after an async step (fetching the CSRF token) but
 * must still chain like one (`.attach(…).expect(201)`): calls are recorded and replayed on the
 * real request, which is sent when the chain is awaited. (`build` wraps the request in an object
 * because a bare thenable returned from a promise would be awaited, i.e. sent, too early.)
 */
function deferred(build: () => Promise<{ real: request.Test }>): request.Test {
  const calls: Array<[PropertyKey, unknown[]]> = [];
  let sent: Promise<unknown> | undefined;
  const send = () =>
    (sent ??= build().then(({ real }) => {
      for (const [name, args] of calls) (real as unknown as Record<PropertyKey, (...a: unknown[]) => unknown>)[name](...args);
      return real; // a thenable: awaiting it sends the request and yields the response
    }));
  const proxy: object = new Proxy(
    {},
    {
      get(_target, prop) {
        if (prop === "then") return (ok?: (v: unknown) => unknown, fail?: (e: unknown) => unknown) => send().then(ok, fail);
        if (prop === "catch") return (fail: (e: unknown) => unknown) => send().catch(fail);
        if (prop === "finally") return (f: () => void) => send().finally(f);
        if (prop === "end") return (cb: (err: unknown, res?: unknown) => void) => void send().then((res) => cb(null, res), cb);
        return (...args: unknown[]) => {
          calls.push([prop, args]);
          return proxy;
        };
      },
    },
  );
  return proxy as request.Test;
}

/** A verified user straight in the database, with a unique e-mail. */
export async function createUser(t: TestApp, name = "Test user"): Promise<User> {
  const email = `${name.toLowerCase().replace(/[^a-z0-9]+/g, "-")}-${randomUUID().slice(0, 8)}@test.example`;
  return t.dataSource.getRepository(User).save({ email, displayName: name, passwordHash: TEST_HASH, emailVerifiedAt: new Date() });
}

export async function signedInClient(t: TestApp, user: User): Promise<TestClient> {
  const client = new TestClient(t);
  await client.signIn(user.email);
  return client;
}

export interface LabFixture {
  lab: Lab;
  /** The outsider's own lab, where they are owner. */
  otherLab: Lab;
  users: Record<LabRole | "outsider", User>;
  clients: Record<LabRole | "outsider" | "anonymous", TestClient>;
}

/** A lab with one signed-in owner, member and viewer, and a signed-in user of another lab. */
export async function labWithRoles(t: TestApp): Promise<LabFixture> {
  const [owner, member, viewer, outsider] = await Promise.all(["Owner", "Member", "Viewer", "Outsider"].map((n) => createUser(t, n)));
  const lab = await t.dataSource.getRepository(Lab).save({ name: `Lab ${randomUUID().slice(0, 6)}`, institution: "Test Institute", createdById: owner.id });
  const otherLab = await t.dataSource.getRepository(Lab).save({ name: `Other lab ${randomUUID().slice(0, 6)}`, institution: "Elsewhere", createdById: outsider.id });
  await t.dataSource.getRepository(LabMembership).save([
    { labId: lab.id, userId: owner.id, role: "owner" },
    { labId: lab.id, userId: member.id, role: "member" },
    { labId: lab.id, userId: viewer.id, role: "viewer" },
    { labId: otherLab.id, userId: outsider.id, role: "owner" },
  ]);
  const [co, cm, cv, cx] = await Promise.all([owner, member, viewer, outsider].map((u) => signedInClient(t, u)));
  return { lab, otherLab, users: { owner, member, viewer, outsider }, clients: { owner: co, member: cm, viewer: cv, outsider: cx, anonymous: new TestClient(t) } };
}
