import { mkdirSync, mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { chromium, type BrowserContext, type Page } from "playwright-core";

/** Where screenshots of browser tests are kept (git-ignored). */
export const ARTIFACTS = "test-artifacts/e2e";

/** Flags that let headless Chromium run here: no sandbox as root, no GPU, no calls home. */
const FLAGS = ["--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"];

export interface Browser {
  context: BrowserContext;
  page: Page;
  /** Errors the page threw or logged, so a test can assert there were none. */
  errors: string[];
  shot: (name: string, target?: { screenshot: Page["screenshot"] }) => Promise<string>;
  close: () => Promise<void>;
}

export async function openBrowser({ viewport = { width: 1360, height: 900 }, extraFlags = [] as string[] } = {}): Promise<Browser> {
  const profile = mkdtempSync(join(tmpdir(), "rhomb-e2e-"));
  const context = await chromium.launchPersistentContext(profile, { executablePath: process.env.RHOMB_CHROMIUM ?? "/usr/bin/chromium", headless: true, args: [...FLAGS, ...extraFlags], viewport });
  const page = context.pages()[0] ?? (await context.newPage());
  const errors: string[] = [];
  page.on("pageerror", (e) => errors.push(`page error: ${e.message}`));
  mkdirSync(ARTIFACTS, { recursive: true });
  return {
    context,
    page,
    errors,
    shot: async (name, target = page) => {
      const path = join(ARTIFACTS, `${name}.png`);
      await target.screenshot({ path, ...(target === page && { fullPage: true }) });
      return path;
    },
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}
