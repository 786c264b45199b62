import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Lab } from "../../server/entities/Lab";
import { TestClient, createUser, signedInClient } from "../support/clients";
import { startTestApp, type TestApp } from "../support/testApp";

/**
 * Cross-site request forgery: a write must carry the token of its own sign-in session in the
 * X-CSRF-Token header (synchroniser-token pattern, OWASP CSRF Prevention Cheat Sheet).
 */
describe("CSRF protection", () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  it("refuses a signed-in write without the token, and stores nothing", async () => {
    const client = await signedInClient(t, await createUser(t, "Forged"));
    const res = await client.withoutCsrf().post("/api/labs", { name: "Forged lab" }).expect(403);
    expect(res.body.error.code).toBe("csrf_invalid");
    expect(res.body.error.message).toMatch(/Reload the page/);
    expect(await t.dataSource.getRepository(Lab).countBy({ name: "Forged lab" })).toBe(0);
  });

  it("refuses another session's token", async () => {
    const victim = await signedInClient(t, await createUser(t, "Victim"));
    const attacker = new TestClient(t);
    const attackerToken = await attacker.csrf();
    const res = await victim.withoutCsrf().post("/api/labs", { name: "Stolen-token lab" }).set("X-CSRF-Token", attackerToken).expect(403);
    expect(res.body.error.code).toBe("csrf_invalid");
  });

  it("accepts the session's own token", async () => {
    const client = await signedInClient(t, await createUser(t, "Honest"));
    await client.post("/api/labs", { name: "Honest lab" }).expect(201);
  });

  it("protects sign-in itself, so nobody can sign a victim into the attacker's account", async () => {
    const user = await createUser(t, "Login forgery");
    const res = await new TestClient(t).withoutCsrf().post("/api/auth/sign-in", { email: user.email, password: "x" }).expect(403);
    expect(res.body.error.code).toBe("csrf_invalid");
  });

  it("issues a new token when sign-in regenerates the session; the old one stops working", async () => {
    const user = await createUser(t, "Regenerated");
    const client = new TestClient(t);
    const before = await client.csrf();
    const signIn = await client.post("/api/auth/sign-in", { email: user.email, password: "correct-horse-battery-staple" }).expect(200);
    const after = signIn.headers["x-csrf-token"];
    expect(after).toBeTruthy();
    expect(after).not.toBe(before);
    const stale = await client.withoutCsrf().post("/api/labs", { name: "Stale" }).set("X-CSRF-Token", before).expect(403);
    expect(stale.body.error.code).toBe("csrf_invalid");
    await client.agent.post("/api/labs").set("X-CSRF-Token", after).send({ name: "Fresh" }).expect(201);
  });

  it("does not check requests that carry a Bearer token, and never lets the cookie authenticate them", async () => {
    const client = await signedInClient(t, await createUser(t, "Bearer"));
    // 401 (not 403 csrf_invalid): the CSRF check was skipped, and the bad token, not the valid
    // session cookie beside it, decided who is calling.
    const res = await client.withoutCsrf().post("/api/labs", { name: "Bearer lab" }).set("Authorization", "Bearer not-a-real-token").expect(401);
    expect(res.body.error.code).not.toBe("csrf_invalid");
    expect(await t.dataSource.getRepository(Lab).countBy({ name: "Bearer lab" })).toBe(0);
  });
});
