import type { Request } from "express";
import { ipKeyGenerator, rateLimit } from "express-rate-limit";
import { tooManyRequests } from "./errors";

/**
 * Attempts per client, counted in this process's memory (express-rate-limit's default store):
 * enough to stop password guessing and mail bombing from one address; several web processes
 * would each count their own share.
 */
const ip = (req: Request) => ipKeyGenerator(req.ip ?? "");
const emailOf = (req: Request) => String((req.body as { email?: unknown } | undefined)?.email ?? "").trim().toLowerCase();

function limiter(windowMinutes: number, limit: number, key: (req: Request) => string, what: string, onlyFailures = false) {
  return rateLimit({
    windowMs: windowMinutes * 60_000,
    limit,
    skipSuccessfulRequests: onlyFailures,
    standardHeaders: "draft-8",
    legacyHeaders: false,
    keyGenerator: key,
    handler: (_req, _res, next) => next(tooManyRequests(`Too many ${what} from here. Wait ${windowMinutes} minutes and try again.`)),
  });
}

/** Password guessing against one account: 10 failed tries per address per 15 minutes. */
export const signInLimit = limiter(15, 10, (req) => `${ip(req)}|${emailOf(req)}`, "failed sign-in attempts for this e-mail address", true);

/** New accounts: 20 per hour from one address. */
export const signUpLimit = limiter(60, 20, ip, "sign-ups");

/** Reset and confirmation mails: 5 per e-mail address per 15 minutes, so nobody's inbox is flooded. */
export const mailRequestLimit = limiter(15, 5, (req) => `${ip(req)}|${emailOf(req)}`, "e-mail requests for this address");
