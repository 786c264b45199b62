import type { RequestHandler } from "express";
import { db } from "../db/dataSource";
import { hasBearerToken } from "./csrf";

/** Who is calling: set on req.user by loadUser for every API request. */
export interface AuthUser {
  id: string;
  email: string;
  displayName: string;
  /** Set when the caller authenticated with a personal API token instead of a browser session. */
  token?: { id: string; labId: string };
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      user?: AuthUser;
    }
  }
}

/**
 * Loads the signed-in user from the sign-in session, if any. A request carrying a Bearer token
 * is never authenticated by the cookie: it skipped the CSRF check, so the token alone must count.
 */
export const loadUser: RequestHandler = async (req, _res, next) => {
  try {
    const userId = hasBearerToken(req) ? undefined : req.session?.userId;
    if (userId) {
      // Plain SQL: this runs on every API request, and TypeORM's query building was a
      // measurable share of a run page's CPU time under load (npm run load).
      const [user]: Array<{ id: string; email: string; display_name: string }> = await db().query("SELECT id, email, display_name FROM users WHERE id = $1", [userId]);
      if (user) req.user = { id: user.id, email: user.email, displayName: user.display_name };
      else delete req.session.userId;
    }
    next();
  } catch (err) {
    next(err);
  }
};
