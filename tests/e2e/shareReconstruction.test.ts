/**
 * One reconstructed state leaves the lab, in a real browser against the real server: the owner
 * shares the maximum-likelihood reconstruction shown on a run page by link, and the link opens
 * in a fresh browser context (no sign-in) as a read-only page: the same figures, the 3D bars,
 * and none of the lab's controls. (tests/e2e/sharing.test.ts shares a whole run.)
 */
import { afterEach, beforeEach, describe, expect, inject, it } from "vitest";
import config from "../../tailwind.config";
import { openBrowser, type Browser } from "./support/browser";
import { canvasColours } from "./support/canvasPixels";
import { signIn } from "./support/signIn";

const baseUrl = inject("baseUrl");
const colours = config.theme.extend.colors;

let owner: Browser;
let visitor: Browser;
beforeEach(async () => {
  [owner, visitor] = await Promise.all([openBrowser(), openBrowser()]);
});
afterEach(async () => {
  await Promise.all([owner?.close(), visitor?.close()]);
});

describe("sharing a reconstruction", () => {
  it("the link opens the state read-only, with the figures the lab sees, in a browser that never signed in", async () => {
    const labId = (await signIn(owner.page, baseUrl, "owner@larkspur.example")).split("/labs/")[1];
    const runs = await (await owner.page.request.get(`${baseUrl}/api/labs/${labId}/runs?kind=tomography&q=20%20mW&pageSize=1`)).json();
    const run = runs.data[0];
    const page = owner.page;
    await page.goto(`${baseUrl}/labs/${labId}/runs/${run.id}`);
    const figures = page.getByTestId("key-figures");
    await figures.waitFor();
    const labFigures = await figures.innerText();
    await page.getByRole("button", { name: "Share state" }).click();
    await page.getByRole("dialog").getByRole("button", { name: "Make a read-only link" }).click();
    const url = await page.getByTestId("share-url").innerText();
    expect(url).toMatch(/\/shared\/[A-Za-z0-9_-]{43}$/);
    await owner.shot("share-state-01-link");

    const shared = visitor.page;
    expect(await visitor.context.cookies()).toEqual([]);
    await shared.goto(url);
    await shared.getByText("Reconstructed state", { exact: true }).first().waitFor();
    await shared.getByTestId("key-figures").waitFor();
    expect(await shared.getByText(/^Shared read-only by link on /).isVisible()).toBe(true);
    // The numbers a collaborator reads are the lab's own.
    const sharedFigures = await shared.getByTestId("key-figures").innerText();
    for (const figure of labFigures.match(/\d\.\d+ ± \d\.\d+/g) ?? []) expect(sharedFigures).toContain(figure);
    const canvas = shared.getByTestId("bars3d-re").locator("canvas");
    await canvas.waitFor();
    await expect.poll(async () => (await canvasColours(canvas, colours.positive.DEFAULT, colours.negative.DEFAULT)).positive, { timeout: 30_000 }).toBeGreaterThan(0.01);
    expect(await shared.getByRole("table", { name: /^Raw counts, revision \d+/ }).isVisible()).toBe(true);

    // Read-only: no control of the lab's pages, and no way into the lab.
    for (const name of [/^Share/, /Correct counts/, /Reconstruct with these settings/, /New run/, /Compare/]) {
      expect(await shared.getByRole("button", { name }).count(), String(name)).toBe(0);
      expect(await shared.getByRole("link", { name }).count(), String(name)).toBe(0);
    }
    expect(await shared.locator("form").count()).toBe(0);
    expect((await shared.request.get(`${baseUrl}/api/labs/${labId}/runs/${run.id}`)).status()).toBe(401);
    await visitor.shot("share-state-02-shared");
    expect([...owner.errors, ...visitor.errors]).toEqual([]);
  });
});
