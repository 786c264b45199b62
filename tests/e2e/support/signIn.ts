import type { Page } from "playwright-core";

/** Demo password of the seeded accounts (server/db/seeds/demoAccounts.ts). */
const PASSWORD = process.env.RHOMB_DEMO_PASSWORD ?? "larkspur-photons";

/** Signs in through the form and waits for the lab home the app opens afterwards; returns its URL. */
export async function signIn(page: Page, baseUrl: string, email: string, password = PASSWORD): Promise<string> {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(/\/labs\/[0-9a-f-]{36}$/);
  return page.url();
}
