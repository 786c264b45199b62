import { fakeMailbox } from "../../server/mail/mailer";
import type { CaughtMail } from "../../server/mail/fakeSmtp";

/**
 * Reads mail the app really sent over SMTP to the in-process fake server. Mail goes out after
 * the response in some flows (password reset), so this waits for it.
 */
export async function mailTo(email: string, subject?: RegExp, timeoutMs = 5000): Promise<CaughtMail> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const found = fakeMailbox()?.messages.find((m) => m.to.includes(email.toLowerCase()) && (!subject || subject.test(m.subject)));
    if (found) return found;
    if (Date.now() > deadline) throw new Error(`no mail to ${email}${subject ? ` with subject ${subject}` : ""} within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 25));
  }
}

/** Every message to this address so far (newest first). */
export function allMailTo(email: string): CaughtMail[] {
  return fakeMailbox()?.messages.filter((m) => m.to.includes(email.toLowerCase())) ?? [];
}

/** The token of the link in `mail` that opens `path` (e.g. "/reset-password"). */
export function linkToken(mail: CaughtMail, path: string): string {
  const link = mail.links.find((l) => new URL(l).pathname === path);
  if (!link) throw new Error(`no ${path} link in mail "${mail.subject}": ${mail.links.join(", ")}`);
  const token = new URL(link).searchParams.get("token");
  if (!token) throw new Error(`the ${path} link has no token: ${link}`);
  return token;
}
