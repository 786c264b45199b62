import type { Request, RequestHandler } from "express";
import { rateLimit } from "express-rate-limit";
import { LIMITS } from "@shared/limits";
import { authenticateToken, hashSecret } from "../services/apiTokens";
import { hasBearerToken } from "./csrf";
import { tooManyRequests } from "./errors";

/**
 * Personal API tokens: `Authorization: Bearer rhb_…` → req.user with `token: { id, labId }`.
 * Runs after loadUser, which ignores the cookie of such requests (csrf.ts exempts them, since a
 * browser never adds this header by itself). A bad token is a 401, never a silent anonymous call.
 */
function bearerSecret(req: Request): string {
  return (req.get("authorization") ?? "").replace(/^Bearer\s+/i, "").trim();
}

/**
 * Per token, counted in this process's memory: with several web processes each counts its own
 * share, which still bounds a runaway acquisition script (a shared store would be needed for an
 * exact lab-wide figure).
 */
const perTokenLimit = rateLimit({
  windowMs: 60_000,
  limit: LIMITS.apiTokenRequestsPerMinute,
  standardHeaders: "draft-8",
  legacyHeaders: false,
  skip: (req) => !hasBearerToken(req),
  keyGenerator: (req) => hashSecret(bearerSecret(req)),
  handler: (_req, _res, next) =>
    next(tooManyRequests(`This API token sent more than ${LIMITS.apiTokenRequestsPerMinute} requests in a minute. Wait a minute, then send fewer (e.g. one run per request as it finishes).`)),
});

const authenticate: RequestHandler = async (req, _res, next) => {
  if (!hasBearerToken(req)) return next();
  try {
    req.user = await authenticateToken(bearerSecret(req));
    next();
  } catch (err) {
    next(err);
  }
};

export const tokenAuth: RequestHandler[] = [perTokenLimit, authenticate];
