import type { ErrorRequestHandler, RequestHandler } from "express";
import { ZodError } from "zod";
import { MulterError } from "multer";
import { logger } from "../logger";
import { HttpError, conflict, invalid, notFound, payloadTooLarge, serviceUnavailable } from "./errors";
import { zodDetails } from "./validate";

/** PostgreSQL / driver failures that mean "the database is not there right now". */
const UNAVAILABLE_CODES = new Set(["ECONNREFUSED", "ECONNRESET", "ETIMEDOUT", "57P01", "57P02", "57P03", "08000", "08003", "08006", "08001", "08004"]);

function isDatabaseUnavailable(err: unknown): boolean {
  const e = err as { code?: string; message?: string; driverError?: { code?: string } };
  const code = e?.code ?? e?.driverError?.code;
  if (code && UNAVAILABLE_CODES.has(code)) return true;
  const msg = e?.message ?? "";
  return /Connection terminated|connect ECONNREFUSED|terminating connection|the database system is (starting up|shutting down)|Client has encountered a connection error|timeout exceeded when trying to connect/i.test(msg);
}

export function toHttpError(err: unknown): HttpError {
  if (err instanceof HttpError) return err;
  if (err instanceof ZodError) {
    const details = zodDetails(err);
    return new HttpError(400, "invalid", details.map((d) => `${d.field}: ${d.message}`).join("; "), details);
  }
  if (err instanceof MulterError) {
    if (err.code === "LIMIT_FILE_SIZE") return payloadTooLarge(`File "${err.field ?? "file"}" is larger than the limit.`);
    return invalid(err.field ?? "file", err.message);
  }
  const e = err as { type?: string; status?: number; code?: string; driverError?: { code?: string }; detail?: string };
  if (e?.type === "entity.parse.failed") return new HttpError(400, "bad_json", "The request body is not valid JSON.");
  if (e?.type === "entity.too.large") return payloadTooLarge("The request body is larger than the limit.");
  const pgCode = e?.code ?? e?.driverError?.code;
  if (pgCode === "23505") return conflict("That already exists.", e.detail ? { detail: e.detail } : undefined);
  if (pgCode === "22P02") return notFound();
  // A NUL character in text (22021) or jsonb (22P05) that no earlier check caught.
  if (pgCode === "22021" || pgCode === "22P05") return new HttpError(400, "invalid", "A text holds a NUL character (\\u0000) or bytes that are not UTF-8, which cannot be stored; remove it. Nothing was saved.");
  if (isDatabaseUnavailable(err)) return serviceUnavailable();
  return new HttpError(500, "internal", "Something went wrong on our side. Nothing was half-saved; the error is logged.");
}

export const errorMiddleware: ErrorRequestHandler = (err, req, res, _next) => {
  const httpError = toHttpError(err);
  if (httpError.status >= 500) (req.log ?? logger).error({ err }, "request failed");
  if (res.headersSent) return;
  res.status(httpError.status).json({
    error: { code: httpError.code, message: httpError.message, ...(httpError.details ? { details: httpError.details } : {}) },
  });
};

export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new HttpError(404, "not_found", `No API route ${req.method} ${req.path}.`));
};
