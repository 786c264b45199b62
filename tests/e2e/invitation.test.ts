/**
 * A new member joins, in a real browser against the real server: the owner invites an address
 * from the People page, the invitation arrives at the local fake mail server, the invitee opens
 * the link in a browser of their own, creates the account, signs out and signs in again, and
 * finds the lab with a member's rights; the owner sees them on the People page.
 */
import { afterEach, beforeEach, describe, expect, inject, it } from "vitest";
import { mailTo } from "./support/api";
import { openBrowser, type Browser } from "./support/browser";
import { signIn } from "./support/signIn";

const baseUrl = inject("baseUrl");

let owner: Browser;
let invitee: Browser;
beforeEach(async () => {
  [owner, invitee] = await Promise.all([openBrowser(), openBrowser()]);
});
afterEach(async () => {
  await Promise.all([owner?.close(), invitee?.close()]);
});

describe("inviting a member", () => {
  it("the invitee follows the e-mailed link, creates an account, and signs in to the lab as a member", async () => {
    const email = `new-postdoc-${Date.now().toString(36)}@partner.example`;
    const password = "quarter-wave-plate-42";

    const labUrl = await signIn(owner.page, baseUrl, "owner@larkspur.example");
    await owner.page.getByRole("link", { name: "People" }).first().click();
    await owner.page.waitForURL(/\/members$/);
    await owner.page.getByLabel("E-mail address").fill(email);
    await owner.page.getByLabel("Role", { exact: true }).selectOption({ label: "Member" });
    await owner.page.getByRole("button", { name: "Send invitation" }).click();
    await owner.page.getByText("Invitation sent").waitFor();
    expect(await owner.page.getByText(`${email} can join as member`).isVisible()).toBe(true);
    await owner.shot("invite-01-sent");

    // The link as the mail carries it, read from the server's local fake SMTP server.
    const mail = await mailTo(invitee.page, baseUrl, email);
    expect(mail.subject).toMatch(/Quantum Light Group/);
    const link = mail.links.find((l) => new URL(l).pathname === "/invitation");
    expect(link, mail.links.join(", ")).toBeDefined();
    expect(new URL(link!).origin).toBe(baseUrl);

    const page = invitee.page;
    await page.goto(link!);
    await page.getByRole("heading", { name: "You are invited" }).waitFor();
    // The details arrive after the card: wait for them, then read what they say.
    const invitation = page.getByText(`invites ${email} to Quantum Light Group`);
    await invitation.waitFor();
    expect(await invitation.innerText()).toMatch(/^Lab owner invites .* as a member: /);
    await invitee.shot("invite-02-link-opened");
    await page.getByLabel("Your name").fill("New Postdoc");
    await page.getByLabel("Password").fill(password);
    await page.getByRole("button", { name: "Create account and join" }).click();
    await page.waitForURL(labUrl);

    // Signing out and in again: the account and the membership are real, not only this session.
    await page.getByRole("button", { name: /New Postdoc/ }).click();
    await page.getByRole("button", { name: "Sign out" }).click();
    await page.waitForURL((u) => u.pathname === "/sign-in" || u.pathname === "/");
    expect(await signIn(page, baseUrl, email, password)).toBe(labUrl);
    await page.getByRole("heading", { name: "Best state per source" }).waitFor();
    // A member may record runs: the lab home offers a new session.
    expect(await page.getByRole("link", { name: "New session" }).first().isVisible()).toBe(true);
    await invitee.shot("invite-03-signed-in");

    await owner.page.reload();
    const row = owner.page.getByRole("row").filter({ hasText: email });
    await row.waitFor();
    expect(await row.innerText()).toMatch(/New Postdoc[\s\S]*Member/);
    // The invitation was used: it no longer waits in the list of open ones.
    expect(await owner.page.getByRole("button", { name: `Withdraw the invitation to ${email}` }).count()).toBe(0);
    await owner.shot("invite-04-people");
    expect([...owner.errors, ...invitee.errors]).toEqual([]);
  });

  it("a used invitation link says so instead of opening again", async () => {
    const email = `one-time-${Date.now().toString(36)}@partner.example`;
    await signIn(owner.page, baseUrl, "owner@larkspur.example");
    await owner.page.getByRole("link", { name: "People" }).first().click();
    await owner.page.getByLabel("E-mail address").fill(email);
    await owner.page.getByRole("button", { name: "Send invitation" }).click();
    await owner.page.getByText("Invitation sent").waitFor();
    const link = (await mailTo(invitee.page, baseUrl, email)).links.find((l) => new URL(l).pathname === "/invitation")!;

    const page = invitee.page;
    await page.goto(link);
    await page.getByLabel("Your name").fill("Once Only");
    await page.getByLabel("Password").fill("half-wave-plate-17");
    await page.getByRole("button", { name: "Create account and join" }).click();
    await page.waitForURL(/\/labs\/[0-9a-f-]{36}$/);

    // The same link a second time, in a fresh browser without the new sign-in.
    const other = await openBrowser();
    try {
      await other.page.goto(link);
      await other.page.getByText("This invitation can no longer be used").waitFor();
      await other.shot("invite-05-used-link");
      expect(other.errors).toEqual([]);
    } finally {
      await other.close();
    }
  });
});
