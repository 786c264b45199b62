import session from "express-session";
import connectPgSimple from "connect-pg-simple";
import type { DataSource } from "typeorm";
import type { Pool } from "pg";
import type { Request, RequestHandler, Response } from "express";
import type { Config } from "../config";
import { issueCsrfToken } from "./csrf";

declare module "express-session" {
  interface SessionData {
    userId?: string;
    activeLabId?: string;
    /** When the stored expiry was last pushed forward (ms since epoch). */
    refreshedAt?: number;
  }
}

const SESSION_DAYS = 14;
/** How stale the stored expiry may get before a request writes it forward again. */
const REFRESH_EVERY_MS = 60 * 60 * 1000;

/**
 * Sign-in sessions kept in PostgreSQL (table http_sessions, created by a migration). Sessions
 * slide: 14 days after the last use. The store's per-request "touch" is off — it was one
 * committed UPDATE (a WAL flush) on every API call — and `refreshSession` below writes the new
 * expiry at most once an hour instead.
 */
export function sessionMiddleware(config: Config, dataSource: DataSource) {
  const PgStore = connectPgSimple(session);
  // Share TypeORM's pg pool rather than opening a second one.
  const pool = (dataSource.driver as unknown as { master: Pool }).master;
  const secure = config.COOKIE_SECURE === "auto" ? "auto" : config.COOKIE_SECURE === "true";
  return session({
    name: "rhomb.sid",
    secret: config.sessionSecret,
    store: new PgStore({ pool, tableName: "http_sessions", createTableIfMissing: false, pruneSessionInterval: 15 * 60, disableTouch: true }),
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: { httpOnly: true, sameSite: "lax", secure, maxAge: SESSION_DAYS * 24 * 3600 * 1000 },
  });
}

/** Marks a signed-in session modified once an hour, so express-session saves its new expiry. */
export const refreshSession: RequestHandler = (req, _res, next) => {
  const now = Date.now();
  if (req.session?.userId && now - (req.session.refreshedAt ?? 0) > REFRESH_EVERY_MS) req.session.refreshedAt = now;
  next();
};

type SessionReq = { session: session.Session & Partial<session.SessionData> };

/** A fresh session id (at sign-in and sign-out), so a planted or stolen id is worth nothing. */
export function regenerateSession(req: SessionReq): Promise<void> {
  return new Promise((resolve, reject) => req.session.regenerate((err) => (err ? reject(err) : resolve())));
}

export function saveSession(req: SessionReq): Promise<void> {
  return new Promise((resolve, reject) => req.session.save((err) => (err ? reject(err) : resolve())));
}

/** Signs `userId` in on a fresh session id, with a fresh CSRF token in the response header. */
export async function startSignedInSession(req: Request, res: Response, userId: string): Promise<void> {
  await regenerateSession(req);
  req.session.userId = userId;
  issueCsrfToken(req, res);
  await saveSession(req);
}
