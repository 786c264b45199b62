import type { IncomingMessage } from "node:http";
import type { RequestHandler } from "express";
import { decodeUtf8Text } from "@shared/formats/utf8Text";
import { HttpError, invalid } from "./errors";

/**
 * express.json's `verify` hook: a JSON body declared (or defaulted) as UTF-8 must be UTF-8.
 * The body parser would otherwise replace bad bytes with "�" and store a mangled run name from
 * an acquisition script that wrote Latin-1. Bodies in another declared charset are decoded by
 * the parser itself.
 */
export function refuseNonUtf8Json(_req: IncomingMessage, _res: unknown, body: Buffer, encoding: string | null): void {
  if (encoding && !/^utf-?8$/i.test(encoding)) return;
  const decoded = decodeUtf8Text(body);
  if (!decoded.ok) throw new HttpError(400, "bad_json", `The request body is not UTF-8 text (${decoded.reason}); send JSON as UTF-8.`);
}

/**
 * A JSON string may hold "\u0000", which PostgreSQL cannot store in text or jsonb; refuse it
 * here, naming the field, instead of failing at the INSERT.
 */
export const refuseNulInJson: RequestHandler = (req, _res, next) => {
  const at = nulPath(req.body, []);
  next(at === null ? undefined : invalid(at.join(".") || "(body)", "holds a NUL character (\\u0000), which cannot be stored; remove it."));
};

function nulPath(value: unknown, path: string[]): string[] | null {
  if (typeof value === "string") return value.includes("\u0000") ? path : null;
  if (!value || typeof value !== "object") return null;
  for (const [key, child] of Object.entries(value)) {
    if (key.includes("\u0000")) return [...path, key];
    const found = nulPath(child, [...path, key]);
    if (found) return found;
  }
  return null;
}
