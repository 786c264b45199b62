import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { resetConfigForTests } from "../../server/config";
import { Invitation } from "../../server/entities/Invitation";
import { User } from "../../server/entities/User";
import { TestClient, labWithRoles, type LabFixture } from "../support/clients";
import { startTestApp, type TestApp } from "../support/testApp";

/**
 * Mail goes out after the transaction commits, so a mail server that refuses the connection must
 * not undo what was stored; the answer says the e-mail did not go out. (This file's own module
 * copy of the mailer sees an SMTP_URL where nothing listens: port 9 on 127.0.0.1.)
 */
describe("when the SMTP server cannot be reached", () => {
  let t: TestApp;
  let f: LabFixture;
  beforeAll(async () => {
    process.env.SMTP_URL = "smtp://127.0.0.1:9";
    resetConfigForTests();
    t = await startTestApp();
    f = await labWithRoles(t);
  });
  afterAll(async () => {
    delete process.env.SMTP_URL;
    resetConfigForTests();
    await t.close();
  });

  it("keeps the invitation and reports that the e-mail was not sent", async () => {
    const email = `unsent-${randomUUID().slice(0, 8)}@partner.example`;
    const res = await f.clients.owner.post(`/api/labs/${f.lab.id}/invitations`, { email, role: "viewer" }).expect(201);
    expect(res.body.mail).toEqual({ sent: false, error: expect.stringMatching(/could not be sent/) });
    expect(await t.dataSource.getRepository(Invitation).countBy({ labId: f.lab.id, email })).toBe(1);
  });

  it("keeps the new account and says the confirmation e-mail did not go out", async () => {
    const email = `unsent-${randomUUID().slice(0, 8)}@signup.example`;
    const res = await new TestClient(t).post("/api/auth/sign-up", { email, displayName: "Unsent", password: "patient-photon-pair" }).expect(201);
    expect(res.body).toMatchObject({ verificationSent: false, message: expect.stringMatching(/could not be sent/) });
    expect(await t.dataSource.getRepository(User).countBy({ email })).toBe(1);
  });

  it("has no development outbox while a real SMTP server is configured", async () => {
    const res = await new TestClient(t).get("/api/dev/outbox").expect(404);
    expect(res.body.error.code).toBe("not_found");
  });
});
