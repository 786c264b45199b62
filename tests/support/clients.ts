import { randomUUID } from "node:crypto";
import bcrypt from "bcryptjs";
import request from "supertest";
import type { LabRole } from "@shared/schemas/roles";
import { Lab, LabMembership, User } from "../../server/entities/index";
import type { TestApp } from "./testApp";

export const TEST_PASSWORD = "correct-horse-battery-staple";
const TEST_HASH = bcrypt.hashSync(TEST_PASSWORD, 4);

/**
 * A browser-like API client for tests: keeps the sign-in cookie, and adds whatever headers
 * state-changing requests need (CSRF). Use it instead of bare supertest for API tests.
 */
export class TestClient {
  readonly agent: ReturnType<typeof request.agent>;
  private extraHeaders: Record<string, string> = {};

  constructor(readonly t: TestApp) {
    this.agent = request.agent(t.app);
  }

  setHeader(name: string, value: string): void {
    this.extraHeaders[name] = value;
  }

  get(path: string) {
    return this.agent.get(path).set(this.extraHeaders);
  }
  post(path: string, body?: object) {
    const r = this.agent.post(path).set(this.extraHeaders);
    return body === undefined ? r : r.send(body);
  }
  put(path: string, body?: object) {
    const r = this.agent.put(path).set(this.extraHeaders);
    return body === undefined ? r : r.send(body);
  }
  patch(path: string, body?: object) {
    const r = this.agent.patch(path).set(this.extraHeaders);
    return body === undefined ? r : r.send(body);
  }
  delete(path: string) {
    return this.agent.delete(path).set(this.extraHeaders);
  }

  async signIn(email: string, password = TEST_PASSWORD): Promise<void> {
    const res = await this.post("/api/auth/sign-in", { email, password });
    if (res.status !== 200) throw new Error(`sign-in of ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  }
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
  return { lab, users: { owner, member, viewer, outsider }, clients: { owner: co, member: cm, viewer: cv, outsider: cx, anonymous: new TestClient(t) } };
}
