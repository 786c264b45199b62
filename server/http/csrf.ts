import type { Request, RequestHandler, Response } from "express";
import { csrfSync } from "csrf-sync";
import { HttpError } from "./errors";

/**
 * Cross-site request forgery protection: the synchroniser-token pattern of csrf-sync. The token
 * lives in the sign-in session; every POST/PUT/PATCH/DELETE must echo it in the X-CSRF-Token
 * header, which a page on another site can neither read nor set. Requests that authenticate with
 * an `Authorization: Bearer …` API token are exempt: browsers never attach such a header on
 * their own, so a forged cross-site request cannot carry one (and loadUser ignores the cookie
 * for them).
 */
export const CSRF_HEADER = "x-csrf-token";

const csrf = csrfSync({
  getTokenFromRequest: (req) => req.get(CSRF_HEADER),
  skipCsrfProtection: (req) => hasBearerToken(req),
});

export function hasBearerToken(req: Request): boolean {
  return /^Bearer\s+\S/i.test(req.get("authorization") ?? "");
}

export const csrfInvalid = () =>
  new HttpError(403, "csrf_invalid", "This form is out of date (its security token is missing or expired). Reload the page and try again.");

export const csrfProtection: RequestHandler = (req, res, next) => {
  csrf.csrfSynchronisedProtection(req, res, (err?: unknown) => next(err ? csrfInvalid() : undefined));
};

/**
 * The session's token (a new one after the session was regenerated), also sent back in the
 * X-CSRF-Token response header so clients can follow a sign-in or sign-out without a round trip.
 */
export function issueCsrfToken(req: Request, res: Response): string {
  const token = csrf.generateToken(req);
  res.setHeader("X-CSRF-Token", token);
  return token;
}
