import type { Page } from "playwright-core";
import type { CaughtMailDto } from "@shared/schemas/devOutbox";

/**
 * API calls with the page's own sign-in (the browser context's cookies), for set-up a journey
 * does not test: a write sends the session's CSRF token as the web client does.
 */
export async function apiPost<T = Record<string, unknown>>(page: Page, baseUrl: string, path: string, body: object): Promise<T> {
  const { token } = await (await page.request.get(`${baseUrl}/api/auth/csrf-token`)).json();
  const res = await page.request.post(`${baseUrl}${path}`, { data: body, headers: { "X-CSRF-Token": token } });
  if (!res.ok()) throw new Error(`POST ${path}: ${res.status()} ${await res.text()}`);
  return (await res.json()) as T;
}

/**
 * The newest mail to `email` caught by the server's local fake SMTP server (the development
 * outbox, /api/dev/outbox), waiting for it: mail goes out after the response.
 */
export async function mailTo(page: Page, baseUrl: string, email: string, timeoutMs = 15_000): Promise<CaughtMailDto> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const { data } = (await (await page.request.get(`${baseUrl}/api/dev/outbox`)).json()) as { data: CaughtMailDto[] };
    const found = data.find((m) => m.to.includes(email.toLowerCase()));
    if (found) return found;
    if (Date.now() > until) throw new Error(`no mail to ${email} in the outbox within ${timeoutMs} ms`);
    await page.waitForTimeout(200);
  }
}
