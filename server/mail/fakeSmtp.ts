import { randomUUID } from "node:crypto";
import type { AddressInfo } from "node:net";
import { SMTPServer } from "smtp-server";
import { simpleParser, type AddressObject } from "mailparser";
import { logger } from "../logger";

/** One message the fake server received, as the development outbox shows it. */
export interface CaughtMail {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  links: string[];
}

const KEEP = 200;

/**
 * A real SMTP server on 127.0.0.1 that keeps what it receives in memory instead of delivering it,
 * for development and tests (smtp-server + mailparser). Mail still goes through nodemailer and
 * SMTP exactly as in production; only the far end is local.
 */
export class FakeSmtp {
  readonly messages: CaughtMail[] = [];
  private server?: SMTPServer;

  async start(port = 0): Promise<number> {
    const server = new SMTPServer({
      authOptional: true,
      disabledCommands: ["STARTTLS", "AUTH"],
      logger: false,
      onData: (stream, _session, done) => {
        simpleParser(stream)
          .then((parsed) => {
            this.keep({
              id: randomUUID(),
              receivedAt: new Date().toISOString(),
              from: addresses(parsed.from)[0] ?? "",
              to: addresses(parsed.to),
              subject: parsed.subject ?? "",
              text: parsed.text ?? "",
              links: [...new Set((parsed.text ?? "").match(/https?:\/\/[^\s<>"]+/g) ?? [])],
            });
            done();
          })
          .catch((err: Error) => done(err));
      },
    });
    await new Promise<void>((resolve, reject) => {
      server.once("error", reject);
      server.listen(port, "127.0.0.1", () => resolve());
    });
    server.on("error", (err) => logger.error({ err }, "fake SMTP server error"));
    // Never the reason a process stays alive (tests, shutdown).
    server.server.unref();
    this.server = server;
    return (server.server.address() as AddressInfo).port;
  }

  private keep(mail: CaughtMail): void {
    this.messages.unshift(mail);
    this.messages.length = Math.min(this.messages.length, KEEP);
  }
}

function addresses(field: AddressObject | AddressObject[] | undefined): string[] {
  const list = Array.isArray(field) ? field : field ? [field] : [];
  return list.flatMap((a) => a.value.map((v) => (v.address ?? "").toLowerCase())).filter(Boolean);
}
