/**
 * A state leaves the lab, in a real browser against the real server: the owner shares a run by
 * link, a collaborator without an account opens it (3D bars drawn, counts shown, nothing of the
 * lab's people), the owner revokes it and the page then says the link is no longer valid; the
 * seeded guest finds the run shared with them; a printable report prints without screen chrome.
 */
import { afterEach, beforeEach, describe, expect, inject, it } from "vitest";
import config from "../../tailwind.config";
import { openBrowser, type Browser } from "./support/browser";
import { canvasColours } from "./support/canvasPixels";
import { signIn } from "./support/signIn";

const baseUrl = inject("baseUrl");
const colours = config.theme.extend.colors;
const PASSWORD = process.env.RHOMB_DEMO_PASSWORD ?? "larkspur-photons";

let owner: Browser;
let visitor: Browser;
beforeEach(async () => {
  [owner, visitor] = await Promise.all([openBrowser(), openBrowser()]);
});
afterEach(async () => {
  await Promise.all([owner?.close(), visitor?.close()]);
});

/** The first tomography run of the signed-in owner's lab, opened on its page. */
async function openFirstTomographyRun(b: Browser): Promise<{ labId: string; runId: string; name: string }> {
  const labUrl = await signIn(b.page, baseUrl, "owner@larkspur.example");
  const labId = labUrl.split("/labs/")[1];
  const runs = await (await b.page.request.get(`${baseUrl}/api/labs/${labId}/runs?kind=tomography&sort=name&order=asc&pageSize=1`)).json();
  const run = runs.data[0];
  await b.page.goto(`${baseUrl}/labs/${labId}/runs/${run.id}`);
  await b.page.getByTestId("key-figures").waitFor();
  return { labId, runId: run.id, name: run.name };
}

describe("sharing a run", () => {
  it("a link opens the run read-only to anyone holding it, until it is revoked", async () => {
    const { name } = await openFirstTomographyRun(owner);
    await owner.page.getByRole("button", { name: "Share run" }).click();
    await owner.page.getByRole("button", { name: "Make a read-only link" }).click();
    const url = await owner.page.getByTestId("share-url").innerText();
    expect(url).toMatch(/\/shared\/[A-Za-z0-9_-]{43}$/);
    await owner.shot("sharing-01-link-made");

    const page = visitor.page;
    await page.goto(url);
    await page.getByRole("heading", { level: 1, name }).waitFor();
    const canvas = page.getByTestId("bars3d-re").locator("canvas");
    await canvas.waitFor();
    await expect.poll(async () => (await canvasColours(canvas, colours.positive.DEFAULT, colours.negative.DEFAULT)).positive, { timeout: 30_000 }).toBeGreaterThan(0.01);
    expect(await page.getByRole("table", { name: /^Raw counts, revision \d+/ }).isVisible()).toBe(true);
    expect(await page.getByTestId("key-figures").innerText()).toMatch(/Fidelity to Ψ⁻\s+0\.\d+ ± 0\.\d+/);
    const text = await page.locator("body").innerText();
    expect(text).not.toMatch(/@larkspur\.example|Lab owner|Lab member/);
    expect(await page.getByRole("link", { name: "People" }).count()).toBe(0);
    await visitor.shot("sharing-02-shared-view");

    await owner.page.getByRole("button", { name: "Revoke" }).first().click();
    await owner.page.getByRole("button", { name: "Revoke now" }).click();
    await owner.page.getByRole("button", { name: "Revoke now" }).waitFor({ state: "hidden" });
    await page.reload();
    await page.getByText("This link is no longer valid").waitFor();
    expect(await page.getByText(/the lab revoked it on/).isVisible()).toBe(true);
    await visitor.shot("sharing-03-revoked");
    expect([...owner.errors, ...visitor.errors]).toEqual([]);
  });

  it("the seeded guest finds the shared run under “Shared with me” and sees nothing else of the lab", async () => {
    const page = visitor.page;
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByLabel("E-mail").fill("guest@partner.example");
    await page.getByLabel("Password").fill(PASSWORD);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL((u) => !u.pathname.startsWith("/sign-in"));
    await page.goto(`${baseUrl}/shared-with-me`);
    const row = page.getByRole("row").filter({ hasText: "Quantum Light Group" });
    await row.getByRole("link").click();
    await page.waitForURL(/\/guest\/[0-9a-f-]{36}$/);
    await page.getByText("Shared read-only with you").waitFor();
    await page.getByTestId("key-figures").waitFor();
    const labs = await (await page.request.get(`${baseUrl}/api/labs`)).json();
    expect(labs.data).toEqual([]);
    await visitor.shot("sharing-04-guest-view");
    expect(visitor.errors).toEqual([]);
  });

  it("the printable report of a run prints without the toolbar, as a PDF of several pages", async () => {
    const { name } = await openFirstTomographyRun(owner);
    const page = owner.page;
    await page.getByText("Export run ▾").click();
    await page.getByRole("link", { name: "Printable report" }).click();
    await page.getByRole("heading", { level: 1, name }).waitFor();
    await page.getByRole("heading", { name: "ρ element by element" }).first().waitFor();
    await page.emulateMedia({ media: "print" });
    expect(await page.getByRole("button", { name: "Print or save as PDF" }).isVisible()).toBe(false);
    expect(await page.getByRole("button", { name: /Save Re ρ as/ }).first().isVisible()).toBe(false);
    const pdf = await page.pdf({ format: "A4", preferCSSPageSize: true, printBackground: true });
    expect(pdf.subarray(0, 5).toString()).toBe("%PDF-");
    // One page per reconstruction at least (linear and maximum likelihood), plus the counts.
    expect((pdf.toString("latin1").match(/\/Type\s*\/Page[^s]/g) ?? []).length).toBeGreaterThanOrEqual(3);
    await owner.shot("sharing-05-report-print");
    expect(owner.errors).toEqual([]);
  });
});
