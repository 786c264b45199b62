/**
 * The student's day at the optical table, in a real browser against the real server: sign in,
 * open a session, type 16 counts into the grid, save, and read the reconstructed state.
 */
import { afterEach, beforeEach, describe, expect, inject, it } from "vitest";
import { figuresOfMerit, reconstruct, standardSet } from "@shared/physics";
import config from "../../tailwind.config";
import { openBrowser, type Browser } from "./support/browser";
import { canvasColours } from "./support/canvasPixels";
import { signIn } from "./support/signIn";

const baseUrl = inject("baseUrl");
const colours = config.theme.extend.colors;

/**
 * Invented counts near ψ⁻ = (|HV⟩ − |VH⟩)/√2 at about 2000 pairs per second, in the order of the
 * 16-setting set (demo data, not a measurement). For ψ⁻ the expected shares follow from
 * P(a, b) = (1 − a·b)/4 for Bloch vectors a, b (common practice, no source): 1/2 for HV, VH
 * and RL, 0 for HH, VV and DD, 1/4 for the rest.
 */
const COUNTS: Record<string, number> = { HH: 6, HV: 1012, VV: 4, VH: 987, RH: 496, RV: 507, DV: 489, DH: 511, DR: 502, DD: 9, RD: 493, HD: 505, VD: 498, VL: 510, HL: 488, RL: 981 };

let browser: Browser;

// A fresh browser profile per test, so no test depends on another's sign-in or state.
beforeEach(async () => {
  browser = await openBrowser();
});
afterEach(async () => {
  await browser?.close();
});

describe("the counts grid and the state view", () => {
  it("takes 16 typed counts to a rendered 3D state and its fidelity", async () => {
    const { page, shot } = browser;
    await signIn(page, baseUrl, "student@larkspur.example");
    await page.getByRole("heading", { name: "Best state per source" }).waitFor();
    await shot("01-lab-home");

    await page.getByRole("link", { name: "New session" }).first().click();
    await page.getByText("Laser safety", { exact: true }).waitFor();
    expect(await page.getByText("Detectors: high voltage and cryogens", { exact: true }).isVisible()).toBe(true);
    await page.getByLabel("Title").fill("Student bench check");
    await page.getByLabel("Pump wavelength").fill("405");
    await page.getByLabel("Coincidence window (full width)").fill("3");
    await page.getByRole("button", { name: "Open session" }).click();
    await page.waitForURL(/\/sessions\/[0-9a-f-]{36}$/);

    await page.getByRole("link", { name: "New tomography run" }).first().click();
    await page.getByLabel("Run name").fill("bench 5 mW");
    await page.getByLabel("Pump power").fill("5");
    // Keyboard only: the first counts cell, then a number and Enter per setting.
    await page.getByLabel("Coincidences, HH").click();
    for (const label of standardSet("tomo16").labels) {
      await page.keyboard.type(String(COUNTS[label]));
      await page.keyboard.press("Enter");
    }
    expect(await page.getByLabel("Coincidences, RL").inputValue()).toBe("981");
    // Enter after the last setting lands on the save button.
    expect(await page.evaluate(() => document.activeElement?.textContent)).toBe("Save and reconstruct");
    await page.getByTestId("live-figures").waitFor();
    expect(await page.getByTestId("live-figures").innerText()).toMatch(/Fidelity to Ψ⁻\s+0\.9\d\d/);
    await shot("02-counts-grid");

    await page.getByRole("button", { name: "Save and reconstruct" }).click();
    await page.waitForURL(/\/runs\/[0-9a-f-]{36}$/, { timeout: 90_000 });

    const canvas = page.getByTestId("bars3d-re").locator("canvas");
    await canvas.waitFor();
    await expect
      .poll(async () => (await canvasColours(canvas, colours.positive.DEFAULT, colours.negative.DEFAULT)).positive, { timeout: 30_000 })
      .toBeGreaterThan(0.01);
    const drawn = await canvasColours(canvas, colours.positive.DEFAULT, colours.negative.DEFAULT);
    // ψ⁻ has two positive diagonal bars and two negative off-diagonal ones: both colours must show.
    expect(drawn.negative).toBeGreaterThan(0.005);
    expect(drawn.brightnessSpread).toBeGreaterThan(10);

    // The fidelity on the page is the engine's maximum-likelihood result for these counts.
    const rows = standardSet("tomo16").labels.map((setting) => ({ setting, counts: COUNTS[setting] }));
    const expected = figuresOfMerit(reconstruct({ rows }, { method: "mle" }).rho, "psi-").fidelity!;
    const shown = await page.getByTestId("key-figures").getByText(/^0\.\d+ ± 0\.\d+$/).first().innerText();
    expect(Math.abs(Number(shown.split(" ± ")[0]) - expected)).toBeLessThan(0.002);
    expect(await page.locator('[data-metric="fidelityPsiMinus"]').innerText()).toContain(shown);

    // Keyboard focus on the Re ρ chart reads out one element with its uncertainty.
    await page.getByTestId("bars3d-re").focus();
    for (const key of ["ArrowRight", "ArrowDown", "ArrowRight"]) await page.keyboard.press(key);
    expect(await page.locator("#bars3d-re-readout").innerText()).toMatch(/^Re ⟨HV\|ρ\|VH⟩ = −0\.4\d+ ± 0\.0\d+$/);

    await shot("03-state-view");
    await shot("04-density-3d", page.getByRole("region", { name: "Reconstructed state ρ" }));
    expect(browser.errors).toEqual([]);
  });

  it("pastes a block from a spreadsheet, flags a mistyped count, and undoes the paste", async () => {
    const { page, shot } = browser;
    await signIn(page, baseUrl, "student@larkspur.example");
    await page.getByRole("region", { name: "Recent sessions" }).getByRole("link").nth(1).click();
    await page.getByRole("link", { name: "New tomography run" }).first().click();
    const labels = standardSet("tomo16").labels;
    // Label-first rows in another order, as a spreadsheet might hold them; HV has an extra digit.
    const sheet = [...labels].reverse().map((l) => `${l}\t${l === "HV" ? COUNTS[l] * 10 : COUNTS[l]}\t2`).join("\n") + "\n";
    const first = page.getByLabel("Coincidences, HH");
    await first.focus();
    await first.evaluate((el, text) => {
      const data = new DataTransfer();
      data.setData("text/plain", text);
      el.dispatchEvent(new ClipboardEvent("paste", { clipboardData: data, bubbles: true, cancelable: true }));
    }, sheet);
    expect(await page.getByLabel("Coincidences, HV").inputValue()).toBe("10120");
    expect(await page.getByLabel("Exposure, RL").inputValue()).toBe("2");
    expect(await page.getByText(/Pasted 32 values, matched by setting label, into 16 rows/).first().isVisible()).toBe(true);
    await expect.poll(() => page.getByTestId("entry-warnings").innerText()).toMatch(/row 2 \(HV\): 10120 counts, but the other rows imply about/);
    await shot("05-paste-outlier");

    await page.keyboard.press("Control+z");
    expect(await page.getByLabel("Coincidences, HV").inputValue()).toBe("");
    expect(await page.getByLabel("Exposure, RL").inputValue()).toBe("");
    expect(browser.errors).toEqual([]);
  });
});

describe("one counts file", () => {
  it("names the bad cell of a malformed file before sending, stores a good one, and reconstructs it again with corrections", async () => {
    const { page, shot } = browser;
    await signIn(page, baseUrl, "student@larkspur.example");
    await page.getByRole("region", { name: "Recent sessions" }).getByRole("link").nth(1).click();
    await page.getByRole("link", { name: "New tomography run" }).first().click();
    await page.getByRole("radio", { name: "Upload a file" }).check({ force: true });
    const file = page.getByLabel("Counts file (.csv)");
    await file.setInputFiles("examples/batches/bad-day/typo-in-counts.csv");
    // The same parser as the server's: the file line and the column of the typed letter o.
    await expect.poll(() => page.getByRole("alert").innerText()).toMatch(/row 9, column "counts".*Nothing was sent\./s);
    expect(await page.getByRole("button", { name: "Upload and reconstruct" }).isDisabled()).toBe(true);

    await file.setInputFiles("examples/tomography/sagnac2-5mW-tomo16.csv");
    await page.getByText("Read 16 rows for 2 photons").waitFor();
    await page.getByRole("button", { name: "Upload and reconstruct" }).click();
    await page.waitForURL(/\/runs\/[0-9a-f-]{36}$/, { timeout: 90_000 });
    await page.getByTestId("key-figures").waitFor();
    expect(await page.getByTestId("key-figures").innerText()).toMatch(/Fidelity to Ψ⁻\s+0\.\d+ ± 0\.\d+/);
    expect(await page.getByRole("link", { name: "sagnac2-5mW-tomo16.csv" }).isVisible()).toBe(true);
    await shot("07-uploaded-run");

    // The file has singles: reconstruct again with accidentals subtracted; the result is stored and shown.
    const history = page.getByRole("region", { name: "Every reconstruction of this run" }).locator("tbody tr");
    const before = await history.count();
    await page.getByLabel(/Subtract accidentals/).check();
    await page.getByLabel("Window τ (full width)").fill("3");
    await page.getByLabel("Monte Carlo samples").fill("50");
    await page.getByRole("button", { name: "Reconstruct with these settings" }).click();
    await page.getByText("Counts revision 1; accidentals subtracted (τ = 3 ns).").waitFor({ timeout: 60_000 });
    await expect.poll(() => history.count()).toBe(before + 1);
    expect(await history.first().innerText()).toMatch(/shown\s+Maximum likelihood\s+accidentals subtracted \(τ = 3 ns\)/);
    expect(browser.errors).toEqual([]);
  });
});

describe("without WebGL", () => {
  it("shows the state as flat bars and says why", async () => {
    const plain = await openBrowser({ extraFlags: ["--disable-webgl", "--disable-3d-apis"] });
    try {
      const { page, shot } = plain;
      const labId = (await signIn(page, baseUrl, "student@larkspur.example")).split("/").pop();
      // Any tomography run of the seeded lab will do.
      const runs = await (await page.request.get(`${baseUrl}/api/labs/${labId}/runs?kind=tomography&pageSize=1`)).json();
      await page.goto(`${baseUrl}/labs/${labId}/runs/${runs.data[0].id}`);
      await page.getByText("3D view unavailable").waitFor();
      expect(await page.locator("canvas").count()).toBe(0);
      expect(await page.getByRole("img", { name: /Re ρ as flat bars/ }).isVisible()).toBe(true);
      await shot("06-no-webgl", page.getByRole("region", { name: "Reconstructed state ρ" }));
      expect(plain.errors).toEqual([]);
    } finally {
      await plain.close();
    }
  });
});
