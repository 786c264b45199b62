import nodemailer, { type Transporter } from "nodemailer";
import { config } from "../config";
import { logger } from "../logger";
import { FakeSmtp } from "./fakeSmtp";

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
}

export interface MailReport {
  sent: boolean;
  error?: string;
}

let transport: Promise<Transporter | null> | undefined;
let fake: FakeSmtp | undefined;

/** The fake server's mailbox, when this process catches mail itself (else undefined). */
export function fakeMailbox(): FakeSmtp | undefined {
  return fake;
}

/** True when mail is caught by the in-process fake server (development, tests). */
export function usingFakeSmtp(): boolean {
  const c = config();
  return !c.SMTP_URL && c.RHOMB_FAKE_SMTP === "1";
}

/**
 * SMTP_URL when set; otherwise, with RHOMB_FAKE_SMTP=1, the in-process fake server (started on
 * first use); otherwise none, and mail is only logged.
 */
async function createTransport(): Promise<Transporter | null> {
  const c = config();
  if (c.SMTP_URL) return nodemailer.createTransport(c.SMTP_URL);
  if (c.RHOMB_FAKE_SMTP !== "1") return null;
  fake = new FakeSmtp();
  const port = await fake.start(c.RHOMB_FAKE_SMTP_PORT);
  logger.info({ port }, "mail goes to the local fake SMTP server; see the development outbox at /dev/outbox");
  return nodemailer.createTransport({ host: "127.0.0.1", port, secure: false, ignoreTLS: true });
}

/**
 * Sends one message. Call it after the transaction that caused it has committed: a failure is
 * logged and reported, and never undoes what was stored.
 */
export async function sendMail(mail: OutgoingMail): Promise<MailReport> {
  try {
    transport ??= createTransport();
    const t = await transport;
    if (!t) {
      logger.warn({ to: mail.to, subject: mail.subject }, "mail not sent: no SMTP_URL configured");
      return { sent: false, error: "Outgoing mail is not set up on this server (SMTP_URL), so no e-mail was sent." };
    }
    await t.sendMail({ from: config().MAIL_FROM, ...mail });
    return { sent: true };
  } catch (err) {
    logger.error({ err, to: mail.to, subject: mail.subject }, "mail could not be sent");
    return { sent: false, error: "The e-mail could not be sent (the mail server did not accept it); it is logged on the server." };
  }
}
