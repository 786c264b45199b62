/**
 * The postdoc's afternoon, in a real browser against the real server and its queue worker: a
 * member chooses 20 run files of a pump-power sweep, uploads them as one batch, watches the
 * progress bar fill, and opens the session's trend plot with one point per run.
 */
import { afterEach, beforeEach, describe, expect, inject, it } from "vitest";
import { RUN_JSON_FORMAT } from "@shared/formats/runJson";
import { simulateCounts, standardSet } from "@shared/physics";
import { wernerLike } from "../../server/db/seeds/demoStates";
import { apiPost } from "./support/api";
import { openBrowser, type Browser } from "./support/browser";
import { signIn } from "./support/signIn";

const baseUrl = inject("baseUrl");

/**
 * A fine pump sweep of the demo source Sagnac-2 (demo scenario, invented data): ψ⁻ with
 * visibility 0.98, 2,500 pairs and 26,600 singles per second per mW as the seed uses, 2 s per
 * setting, 1 … 20 mW. Accidentals grow with the square of the pump power, so fidelity to ψ⁻
 * (without subtraction) falls along the sweep while the pair rate rises linearly.
 */
function sweepFiles(): Array<{ name: string; mimeType: string; buffer: Buffer }> {
  return Array.from({ length: 20 }, (_, i) => {
    const mw = i + 1;
    const rows = simulateCounts({ rho: wernerLike(0.98), settings: standardSet("tomo16").labels, pairRate: 2500 * mw, seconds: 2, seed: 9000 + mw, singles: { rateA: 26_600 * mw, rateB: 26_600 * mw, windowNs: 3 } });
    const run = { format: RUN_JSON_FORMAT, name: `fine sweep ${mw} mW`, settingSetId: "tomo16", conditions: { pumpPowerMw: mw }, rows: rows.map((r) => ({ setting: r.setting, counts: r.counts, seconds: r.seconds, singlesA: r.singlesA, singlesB: r.singlesB })) };
    return { name: `sagnac2-fine-${String(mw).padStart(2, "0")}mW.json`, mimeType: "application/json", buffer: Buffer.from(JSON.stringify(run, null, 1)) };
  });
}

let browser: Browser;
beforeEach(async () => {
  browser = await openBrowser();
});
afterEach(async () => {
  await browser?.close();
});

describe("batch upload", () => {
  it("uploads 20 files, shows the progress bar to the end, and plots the sweep", async () => {
    const { page, shot } = browser;
    const labId = (await signIn(page, baseUrl, "member@larkspur.example")).split("/labs/")[1];
    // A session of its own, so the trend shows exactly this batch.
    const sources = await (await page.request.get(`${baseUrl}/api/labs/${labId}/sources?q=Sagnac-2`)).json();
    const title = `Fine pump sweep ${Date.now().toString(36)}`;
    await apiPost(page, baseUrl, `/api/labs/${labId}/sessions`, { sourceId: sources.data[0].id, title, date: "2026-03-20", coincidenceWindowNs: 3, pumpWavelengthNm: 405 });

    await page.goto(`${baseUrl}/labs/${labId}/batches`);
    await page.getByRole("heading", { name: "Batch upload" }).waitFor();
    await page.getByLabel("Into session").selectOption({ label: `2026-03-20 · ${title} (Sagnac-2)` });
    await page.locator('input[type="file"]').setInputFiles(sweepFiles());
    expect(await page.getByText(/^20 files, /).isVisible()).toBe(true);
    await shot("batch-01-chosen");
    await page.getByRole("button", { name: "Upload 20 files" }).click();

    await page.waitForURL(/\/batches\/[0-9a-f-]{36}$/);
    await page.getByRole("heading", { name: "Batch of 20 files" }).waitFor();
    const bar = page.getByRole("progressbar");
    expect(await bar.getAttribute("aria-valuemax")).toBe("20");
    // Watch the bar: what it says may only grow, and it ends at 20. A worker stores a 20-file
    // batch in about a second, which is the page's polling interval, so the bar may go from 0
    // to 20 in one step; an intermediate value is photographed when seen but not required.
    const seen: number[] = [];
    const until = Date.now() + 240_000;
    while (seen.at(-1) !== 20 && Date.now() < until) {
      const now = Number(await bar.getAttribute("aria-valuenow"));
      if (now > 0 && now < 20 && !seen.some((v) => v > 0)) await shot("batch-02-progress");
      seen.push(now);
      await page.waitForTimeout(200);
    }
    expect(seen.at(-1)).toBe(20);
    expect(seen.every((v, i) => i === 0 || v >= seen[i - 1]), seen.join(",")).toBe(true);
    await page.getByText("Batch finished — 20 of 20 files done").waitFor();
    expect(await page.getByText("All 20 files are in the session").isVisible()).toBe(true);
    expect(await page.getByRole("list", { name: "Files by status" }).innerText()).toMatch(/Stored:\s*20/);
    expect(await page.getByRole("link", { name: "Run “fine sweep 20 mW”" }).isVisible()).toBe(true);
    await shot("batch-03-finished");

    await page.getByRole("link", { name: title }).click();
    await page.getByRole("heading", { level: 1, name: title }).waitFor();
    await page.getByRole("link", { name: "Trends" }).last().click();
    await page.waitForURL(/\/trends\?sessionId=/);
    const table = page.getByRole("table", { name: `Runs of ${title}` });
    await table.waitFor();
    const rows = table.locator("tbody tr");
    expect(await rows.count()).toBe(20);
    // What the table shows for the ends of the sweep: pair rate ∝ pump power, fidelity falling.
    const cells = async (name: string) => (await table.getByRole("row").filter({ hasText: name }).getByRole("cell").allInnerTexts()).map((t) => t.trim());
    const [low, high] = [await cells("fine sweep 1 mW"), await cells("fine sweep 20 mW")];
    const number = (s: string) => Number(s.split("±")[0].replace(/[^0-9.]/g, ""));
    const header = (await table.getByRole("columnheader").allInnerTexts()).map((t) => t.trim());
    const pair = header.findIndex((h) => h.startsWith("Pair rate"));
    const fidelity = header.findIndex((h) => /fidelity/i.test(h));
    expect(number(high[pair]) / number(low[pair])).toBeGreaterThan(15);
    expect(number(high[pair]) / number(low[pair])).toBeLessThan(25);
    expect(number(high[fidelity])).toBeLessThan(number(low[fidelity]) - 0.02);
    const chart = page.getByRole("figure").filter({ hasText: /against pump power/i }).first();
    expect(await chart.isVisible()).toBe(true);
    await shot("batch-04-trend");
    expect(browser.errors).toEqual([]);
  });
});
