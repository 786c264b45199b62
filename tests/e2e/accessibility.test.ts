/**
 * Accessibility of the main pages, in a real browser against the real server: axe-core
 * (WCAG 2.2 A/AA rules and its best practices) finds no serious or critical violation, and
 * pressing Tab from the top of each page reaches every visible control (nothing is
 * mouse-only). Then a student records a whole run with the keyboard alone.
 */
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { standardSet } from "@shared/physics";
import { seriousViolations, walkWithTab } from "./support/a11y";
import { apiPost } from "./support/api";
import { openBrowser, type Browser } from "./support/browser";
import { signIn } from "./support/signIn";

const baseUrl = inject("baseUrl");

interface Ids {
  labId: string;
  sessionId: string;
  tomographyRunId: string;
  bellRunId: string;
  fringeRunId: string;
  batchId: string;
  sharedUrl: string;
}

let owner: Browser;
let ids: Ids;

const get = async (path: string) => {
  const res = await owner.page.request.get(`${baseUrl}${path}`);
  if (!res.ok()) throw new Error(`GET ${path}: ${res.status()}`);
  return res.json();
};

beforeAll(async () => {
  owner = await openBrowser();
  const labId = (await signIn(owner.page, baseUrl, "owner@larkspur.example")).split("/labs/")[1];
  const sessions = await get(`/api/labs/${labId}/sessions?q=Pump%20power%20sweep`);
  const sessionId = sessions.data[0].id;
  const run = async (kind: string) => (await get(`/api/labs/${labId}/runs?kind=${kind}&pageSize=1&sort=name&order=asc`)).data[0].id as string;
  const tomographyRunId = (await get(`/api/labs/${labId}/runs?kind=tomography&sessionId=${sessionId}&pageSize=1&sort=name&order=asc`)).data[0].id;
  // A batch of one file with a bad row: the batch page then shows a failed file and its message.
  const { token } = await (await owner.page.request.get(`${baseUrl}/api/auth/csrf-token`)).json();
  const bad = "basis,counts\nHH,12\nHV,1x\n";
  const batch = await owner.page.request.post(`${baseUrl}/api/labs/${labId}/sessions/${sessionId}/batches`, {
    headers: { "X-CSRF-Token": token },
    multipart: { files: { name: "a11y-bad.csv", mimeType: "text/csv", buffer: Buffer.from(bad) } },
  });
  if (batch.status() !== 202) throw new Error(`batch upload: ${batch.status()} ${await batch.text()}`);
  const detail = await get(`/api/labs/${labId}/runs/${tomographyRunId}`);
  const mle = detail.reconstructions.find((r: { method: string }) => r.method === "mle");
  const share = await apiPost<{ link: { url: string } }>(owner.page, baseUrl, `/api/labs/${labId}/shares`, { kind: "link", itemType: "reconstruction", itemId: mle.id, label: "accessibility check" });
  ids = { labId, sessionId, tomographyRunId, bellRunId: await run("bell"), fringeRunId: await run("fringe"), batchId: (await batch.json()).id, sharedUrl: share.link.url };
}, 120_000);
afterAll(async () => {
  await owner?.close();
});

/** Opens a page, waits for what shows it is ready, and checks it with axe and with Tab. */
async function check(b: Browser, name: string, path: string, ready: (p: Browser["page"]) => Promise<unknown>) {
  const { page } = b;
  await page.goto(path.startsWith("http") ? path : `${baseUrl}${path}`);
  await ready(page);
  const violations = await seriousViolations(page);
  await b.shot(`a11y-${name}`);
  expect(violations, JSON.stringify(violations, null, 1)).toEqual([]);
  const walk = await walkWithTab(page);
  expect(walk.missed, `reached by Tab: ${walk.reached.join(" | ")}`).toEqual([]);
  expect(walk.unmarked, "focused without a visible focus indicator").toEqual([]);
  expect(b.errors).toEqual([]);
}

describe("axe-core and Tab on the main pages", () => {
  const heading = (name: string | RegExp) => (p: Browser["page"]) => p.getByRole("heading", { level: 1, name }).waitFor();

  it("sign-in", async () => {
    const anonymous = await openBrowser();
    try {
      await check(anonymous, "sign-in", "/sign-in", (p) => p.getByRole("button", { name: "Sign in" }).waitFor());
    } finally {
      await anonymous.close();
    }
  });

  it("lab home", async () => {
    await check(owner, "lab-home", `/labs/${ids.labId}`, (p) => p.getByRole("heading", { name: "Best state per source" }).waitFor());
  });

  it("session page", async () => {
    await check(owner, "session", `/labs/${ids.labId}/sessions/${ids.sessionId}`, heading(/Pump power sweep/));
  });

  it("new session (setup form with the laser and detector cautions)", async () => {
    await check(owner, "new-session", `/labs/${ids.labId}/sessions/new`, (p) => p.getByText("Laser safety", { exact: true }).waitFor());
  });

  it("counts entry", async () => {
    await check(owner, "counts-entry", `/labs/${ids.labId}/sessions/${ids.sessionId}/runs/new`, (p) => p.getByLabel("Coincidences, HH").waitFor());
  });

  it("run state view", async () => {
    await check(owner, "run-state", `/labs/${ids.labId}/runs/${ids.tomographyRunId}`, async (p) => {
      await p.getByTestId("key-figures").waitFor();
      await p.getByTestId("bars3d-re").locator("canvas").waitFor();
    });
  });

  it("batch upload", async () => {
    await check(owner, "batch-upload", `/labs/${ids.labId}/batches`, heading("Batch upload"));
  });

  it("batch page", async () => {
    await check(owner, "batch", `/labs/${ids.labId}/batches/${ids.batchId}`, (p) => p.getByText(/Batch finished/).waitFor({ timeout: 60_000 }));
  });

  it("shared view, opened without an account", async () => {
    const visitor = await openBrowser();
    try {
      await check(visitor, "shared-view", ids.sharedUrl, (p) => p.getByTestId("key-figures").waitFor());
    } finally {
      await visitor.close();
    }
  });

  it("Bell test", async () => {
    await check(owner, "bell", `/labs/${ids.labId}/runs/${ids.bellRunId}/bell-test`, (p) => p.getByText(/CHSH|S =/).first().waitFor());
  });

  it("fringe fit", async () => {
    await check(owner, "fringe", `/labs/${ids.labId}/runs/${ids.fringeRunId}/fringe-fit`, (p) => p.getByText(/[Vv]isibility/).first().waitFor());
  });

  it("trends", async () => {
    await check(owner, "trends", `/labs/${ids.labId}/trends?sessionId=${ids.sessionId}`, (p) => p.getByRole("table", { name: /^Runs of / }).waitFor());
  });

  it("people", async () => {
    await check(owner, "people", `/labs/${ids.labId}/members`, (p) => p.getByRole("button", { name: "Send invitation" }).waitFor());
  });
});

describe("keyboard only", () => {
  it("a student records 16 counts and saves the run without touching the mouse", async () => {
    const student = await openBrowser();
    try {
      const { page } = student;
      await signIn(page, baseUrl, "student@larkspur.example");
      // A session of its own, so the run lands nowhere another test looks.
      const sources = await (await page.request.get(`${baseUrl}/api/labs/${ids.labId}/sources?q=Sagnac-2`)).json();
      const session = await apiPost<{ id: string }>(page, baseUrl, `/api/labs/${ids.labId}/sessions`, { sourceId: sources.data[0].id, title: "Keyboard bench", date: "2026-03-21", coincidenceWindowNs: 3 });
      await page.goto(`${baseUrl}/labs/${ids.labId}/sessions/${session.id}/runs/new`);
      await page.getByLabel("Coincidences, HH").waitFor();
      const focused = () => page.evaluate(() => document.activeElement?.getAttribute("aria-label") ?? document.activeElement?.id ?? "");
      const label = async () => page.evaluate(() => (document.activeElement as HTMLInputElement | null)?.labels?.[0]?.textContent?.trim() ?? "");

      // Tab from the top of the page to the run name, then on to the first counts cell.
      await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur());
      for (let i = 0; i < 80 && !(await label()).startsWith("Run name"); i++) await page.keyboard.press("Tab");
      expect(await label()).toMatch(/^Run name/);
      await page.keyboard.type("keyboard only");
      for (let i = 0; i < 40 && (await focused()) !== "Coincidences, HH"; i++) await page.keyboard.press("Tab");
      expect(await focused()).toBe("Coincidences, HH");

      // ψ⁻-like counts (invented): 1/2 for HV, VH, RL; ~0 for HH, VV, DD; 1/4 for the rest.
      const big = new Set(["HV", "VH", "RL"]);
      const small = new Set(["HH", "VV", "DD"]);
      for (const setting of standardSet("tomo16").labels) {
        expect(await focused()).toBe(`Coincidences, ${setting}`);
        await page.keyboard.type(String(big.has(setting) ? 1000 : small.has(setting) ? 8 : 500));
        await page.keyboard.press("Enter");
      }
      expect(await page.evaluate(() => document.activeElement?.textContent)).toBe("Save and reconstruct");
      await page.getByTestId("live-figures").waitFor();
      const violations = await seriousViolations(page);
      expect(violations, JSON.stringify(violations, null, 1)).toEqual([]);
      await student.shot("a11y-keyboard-grid");
      await page.keyboard.press("Enter");
      await page.waitForURL(/\/runs\/[0-9a-f-]{36}$/, { timeout: 90_000 });
      await page.getByRole("heading", { level: 1, name: "keyboard only" }).waitFor();
      await page.getByTestId("key-figures").waitFor();
      expect(await page.getByTestId("key-figures").innerText()).toMatch(/Fidelity to Ψ⁻\s+0\.9\d+ ± 0\.\d+/);
      await student.shot("a11y-keyboard-saved");
      expect(student.errors).toEqual([]);
    } finally {
      await student.close();
    }
  });
});
