import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createUser, signedInClient } from "../support/clients";
import { startTestApp, type TestApp } from "../support/testApp";

/** Sliding sign-in sessions without one database write per request (server/http/session.ts). */
describe("sign-in session expiry", () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  const stored = async (email: string) => {
    const rows: Array<{ sid: string; expire: Date; sess: { refreshedAt?: number } }> = await t.dataSource.query(
      `select sid, expire, sess from http_sessions where sess->>'userId' = (select id::text from users where email = $1)`,
      [email],
    );
    return rows;
  };

  it("does not rewrite the stored session on every request", async () => {
    const user = await createUser(t, "Quiet session");
    const client = await signedInClient(t, user);
    await client.get("/api/auth/me").expect(200);
    const [before] = await stored(user.email);
    for (let i = 0; i < 3; i++) await client.get("/api/labs").expect(200);
    const [after] = await stored(user.email);
    expect(after.expire.getTime()).toBe(before.expire.getTime());
  });

  it("pushes the expiry forward once the last refresh is over an hour old", async () => {
    const user = await createUser(t, "Sliding session");
    const client = await signedInClient(t, user);
    await client.get("/api/auth/me").expect(200);
    const [row] = await stored(user.email);
    // Pretend the session was last refreshed two hours ago, with an expiry that much earlier.
    await t.dataSource.query(`update http_sessions set sess = jsonb_set(sess::jsonb, '{refreshedAt}', to_jsonb($2::bigint))::json, expire = expire - interval '2 hours' where sid = $1`, [row.sid, Date.now() - 2 * 3600_000]);
    const [old] = await stored(user.email);
    await client.get("/api/labs").expect(200);
    const [fresh] = await stored(user.email);
    expect(fresh.expire.getTime() - old.expire.getTime()).toBeGreaterThan(3600_000);
    expect(fresh.sess.refreshedAt).toBeGreaterThan(Date.now() - 60_000);
  });
});
