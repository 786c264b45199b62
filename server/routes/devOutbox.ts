import { DevOutboxSchema } from "@shared/schemas/devOutbox";
import { ApiRouter } from "../http/endpoint";
import { notFound } from "../http/errors";
import { fakeMailbox, usingFakeSmtp } from "../mail/mailer";

/**
 * The development outbox: mail caught by the in-process fake SMTP server. It exists only while
 * that server is in use (RHOMB_FAKE_SMTP=1 and no SMTP_URL); with real mail it answers 404.
 */
export const devOutboxRouter = new ApiRouter("/dev");

devOutboxRouter.get("/outbox", { summary: "Mail caught by the local fake SMTP server (development and tests only)", auth: "public", tags: ["development"], response: DevOutboxSchema }, async () => {
  if (!usingFakeSmtp()) throw notFound("The development outbox (mail goes to a real SMTP server here)");
  return { data: fakeMailbox()?.messages ?? [] };
});
