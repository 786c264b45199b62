import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { MeSchema } from "@shared/schemas/auth";
import { resetConfigForTests } from "../../server/config";
import { EmailToken } from "../../server/entities/EmailToken";
import { User } from "../../server/entities/User";
import { TEST_PASSWORD, TestClient, createUser, signedInClient } from "../support/clients";
import { allMailTo, linkToken, mailTo } from "../support/mail";
import { startTestApp, type TestApp } from "../support/testApp";

const freshEmail = (tag: string) => `${tag}-${randomUUID().slice(0, 8)}@signup.example`;
const PASSWORD = "tidal-prism-lantern";

describe("sign-up, e-mail confirmation and sign-in", () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  it("creates an unconfirmed account, e-mails a link, and signs in only after the link is opened", async () => {
    const email = freshEmail("ada");
    const client = new TestClient(t);
    const res = await client.post("/api/auth/sign-up", { email: email.toUpperCase(), displayName: "Ada Quill", password: PASSWORD }).expect(201);
    expect(res.body).toMatchObject({ email, verificationSent: true });

    const stored = await t.dataSource.getRepository(User).findOneByOrFail({ email });
    expect(stored.emailVerifiedAt).toBeNull();
    expect(stored.passwordHash).toMatch(/^\$2[aby]\$/);
    expect(stored.passwordHash).not.toContain(PASSWORD);

    const early = await client.post("/api/auth/sign-in", { email, password: PASSWORD }).expect(403);
    expect(early.body.error.code).toBe("email_unverified");

    const mail = await mailTo(email, /Confirm your e-mail/);
    const token = linkToken(mail, "/verify-email");
    const verified = await client.post("/api/auth/verify-email", { token }).expect(200);
    expect(MeSchema.parse(verified.body)).toMatchObject({ email, displayName: "Ada Quill", emailVerified: true });
    await client.get("/api/auth/me").expect(200);

    const again = await new TestClient(t).post("/api/auth/verify-email", { token }).expect(410);
    expect(again.body.error.message).toMatch(/already used/);
  });

  it("answers a duplicate e-mail with 409 naming the field, and creates nothing", async () => {
    const user = await createUser(t, "Taken");
    const before = await t.dataSource.getRepository(User).count();
    const res = await new TestClient(t).post("/api/auth/sign-up", { email: user.email, displayName: "Someone else", password: PASSWORD }).expect(409);
    expect(res.body.error.details).toEqual([{ field: "email", message: expect.stringMatching(/already exists/) }]);
    expect(await t.dataSource.getRepository(User).count()).toBe(before);
  });

  it("says exactly what a weak password lacks, and names every missing field", async () => {
    const email = freshEmail("weak");
    const short = await new TestClient(t).post("/api/auth/sign-up", { email, displayName: "Weak", password: "short" }).expect(400);
    expect(short.body.error.details).toEqual([{ field: "password", message: "The password needs at least 10 characters." }]);
    const same = await new TestClient(t).post("/api/auth/sign-up", { email, displayName: "Weak", password: email }).expect(400);
    expect(same.body.error.details).toEqual([{ field: "password", message: "The password cannot be your e-mail address." }]);
    const long = await new TestClient(t).post("/api/auth/sign-up", { email, displayName: "Weak", password: "ü".repeat(40) }).expect(400);
    expect(long.body.error.details[0]).toMatchObject({ field: "password", message: expect.stringMatching(/at most 72 bytes/) });
    const missing = await new TestClient(t).post("/api/auth/sign-up", {}).expect(400);
    expect(missing.body.error.details.map((d: { field: string }) => d.field).sort()).toEqual(["displayName", "email", "password"]);
    expect(await t.dataSource.getRepository(User).countBy({ email })).toBe(0);
  });

  it("gives the same answer for an unknown e-mail and a wrong password", async () => {
    const user = await createUser(t, "Known");
    const unknown = await new TestClient(t).post("/api/auth/sign-in", { email: freshEmail("nobody"), password: TEST_PASSWORD }).expect(401);
    const wrong = await new TestClient(t).post("/api/auth/sign-in", { email: user.email, password: "not-the-password" }).expect(401);
    expect(unknown.body).toEqual(wrong.body);
    expect(wrong.body.error).toEqual({ code: "bad_credentials", message: "That e-mail and password do not match an account." });
  });

  it("regenerates the session id at sign-in and forgets the user at sign-out", async () => {
    const user = await createUser(t, "Session");
    const client = new TestClient(t);
    await client.csrf(); // an anonymous session exists before signing in
    const cookieBefore = client.agent.jar.getCookie("rhomb.sid", { path: "/", domain: "127.0.0.1", secure: false, script: false })?.value;
    const res = await client.post("/api/auth/sign-in", { email: user.email, password: TEST_PASSWORD }).expect(200);
    const setCookie = String(res.headers["set-cookie"]);
    expect(setCookie).toMatch(/rhomb\.sid=/);
    expect(setCookie).toMatch(/HttpOnly/i);
    expect(setCookie).toMatch(/SameSite=Lax/i);
    expect(setCookie).not.toContain(String(cookieBefore));
    await client.get("/api/auth/me").expect(200);
    await client.post("/api/auth/sign-out").expect(204);
    await client.get("/api/auth/me").expect(401);
  });

  it("re-sends a confirmation link with an answer that does not reveal whether the account exists", async () => {
    const email = freshEmail("resend");
    await new TestClient(t).post("/api/auth/sign-up", { email, displayName: "Resend", password: PASSWORD }).expect(201);
    const known = await new TestClient(t).post("/api/auth/resend-verification", { email }).expect(202);
    const unknown = await new TestClient(t).post("/api/auth/resend-verification", { email: freshEmail("ghost") }).expect(202);
    expect(known.body).toEqual(unknown.body);
    await expect.poll(() => allMailTo(email).length).toBe(2);
  });

  it("rejects an expired confirmation link with 410", async () => {
    const email = freshEmail("late");
    await new TestClient(t).post("/api/auth/sign-up", { email, displayName: "Late", password: PASSWORD }).expect(201);
    const token = linkToken(await mailTo(email), "/verify-email");
    const user = await t.dataSource.getRepository(User).findOneByOrFail({ email });
    await t.dataSource.getRepository(EmailToken).update({ userId: user.id }, { expiresAt: new Date(Date.now() - 1000) });
    const res = await new TestClient(t).post("/api/auth/verify-email", { token }).expect(410);
    expect(res.body.error).toMatchObject({ code: "gone", message: expect.stringMatching(/expired/) });
    const bogus = await new TestClient(t).post("/api/auth/verify-email", { token: "x".repeat(43) }).expect(404);
    expect(bogus.body.error.message).toMatch(/not valid/);
  });

  it("limits failed sign-in attempts for one address (429 after ten); successful ones do not count", async () => {
    const user = await createUser(t, "Guessed");
    for (let i = 0; i < 11; i++) await new TestClient(t).post("/api/auth/sign-in", { email: user.email, password: TEST_PASSWORD }).expect(200);
    const client = new TestClient(t);
    for (let i = 0; i < 10; i++) await client.post("/api/auth/sign-in", { email: user.email, password: `guess-${i}` }).expect(401);
    const res = await client.post("/api/auth/sign-in", { email: user.email, password: TEST_PASSWORD }).expect(429);
    expect(res.body.error.code).toBe("rate_limited");
    // Another account is not locked out by someone guessing this one.
    await signedInClient(t, await createUser(t, "Unaffected"));
  });
});

describe("password reset by e-mail", () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  it("e-mails a single-use link that sets a new password, signs in, and ends other sessions", async () => {
    const user = await createUser(t, "Forgetful");
    const otherBrowser = await signedInClient(t, user);
    const res = await new TestClient(t).post("/api/auth/password-reset", { email: user.email }).expect(202);
    const unknown = await new TestClient(t).post("/api/auth/password-reset", { email: freshEmail("none") }).expect(202);
    expect(res.body).toEqual(unknown.body);

    const token = linkToken(await mailTo(user.email, /new Rhomb password/), "/reset-password");
    const weak = await new TestClient(t).post("/api/auth/password-reset/confirm", { token, password: "short" }).expect(400);
    expect(weak.body.error.details[0].field).toBe("password");

    const browser = new TestClient(t);
    await browser.post("/api/auth/password-reset/confirm", { token, password: "new-quartz-window" }).expect(200);
    await browser.get("/api/auth/me").expect(200);
    await otherBrowser.get("/api/auth/me").expect(401);

    const reused = await new TestClient(t).post("/api/auth/password-reset/confirm", { token, password: "another-quartz-window" }).expect(410);
    expect(reused.body.error.message).toMatch(/already used/);
    await new TestClient(t).post("/api/auth/sign-in", { email: user.email, password: TEST_PASSWORD }).expect(401);
    await new TestClient(t).post("/api/auth/sign-in", { email: user.email, password: "new-quartz-window" }).expect(200);
  });
});

describe("mail requests are limited", () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  it("sends at most five reset mails per address per 15 minutes (429 after that)", async () => {
    const user = await createUser(t, "Flooded");
    for (let i = 0; i < 5; i++) await new TestClient(t).post("/api/auth/password-reset", { email: user.email }).expect(202);
    const res = await new TestClient(t).post("/api/auth/password-reset", { email: user.email }).expect(429);
    expect(res.body.error.message).toMatch(/Wait 15 minutes/);
    await expect.poll(() => allMailTo(user.email).length).toBe(5);
  });
});

describe("own account", () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  it("changes the display name and, with the current password, the password", async () => {
    const user = await createUser(t, "Renamed");
    const client = await signedInClient(t, user);
    const other = await signedInClient(t, user);
    const renamed = await client.patch("/api/account", { displayName: "  Dr. Renamed " }).expect(200);
    expect(renamed.body.displayName).toBe("Dr. Renamed");

    const wrong = await client.post("/api/account/password", { currentPassword: "nope", newPassword: "fresh-photon-path" }).expect(400);
    expect(wrong.body.error.details).toEqual([{ field: "currentPassword", message: "That is not your current password." }]);
    await client.post("/api/account/password", { currentPassword: TEST_PASSWORD, newPassword: "fresh-photon-path" }).expect(204);
    await client.get("/api/auth/me").expect(200);
    await other.get("/api/auth/me").expect(401);
  });
});

describe("cookies behind an HTTPS proxy", () => {
  let t: TestApp;
  beforeAll(async () => {
    process.env.TRUST_PROXY = "true";
    resetConfigForTests();
    t = await startTestApp();
  });
  afterAll(async () => {
    delete process.env.TRUST_PROXY;
    resetConfigForTests();
    await t.close();
  });

  it("marks the sign-in cookie Secure when the proxy says the request came over HTTPS (COOKIE_SECURE=auto)", async () => {
    const user = await createUser(t, "Behind proxy");
    const client = new TestClient(t);
    client.setHeader("X-Forwarded-Proto", "https");
    const res = await client.post("/api/auth/sign-in", { email: user.email, password: TEST_PASSWORD }).expect(200);
    expect(String(res.headers["set-cookie"])).toMatch(/rhomb\.sid=[^;]+;.*Secure/i);
  });
});
