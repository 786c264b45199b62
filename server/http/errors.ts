/**
 * The one error shape of the API: { error: { code, message, details? } }.
 * Services and routes throw these; the error middleware turns them into responses.
 */
export type ErrorDetails = Record<string, unknown> | Array<Record<string, unknown>>;

export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: ErrorDetails,
  ) {
    super(message);
    this.name = "HttpError";
  }
}

export const badRequest = (message: string, details?: ErrorDetails) =>
  new HttpError(400, "bad_request", message, details);

/** A field-level validation error; `field` is a dotted path such as "rows.3.counts". */
export const invalid = (field: string, message: string, extra?: Record<string, unknown>) =>
  new HttpError(400, "invalid", `${field}: ${message}`, [{ field, message, ...extra }]);

export const unauthenticated = (message = "Sign in to continue.") =>
  new HttpError(401, "unauthenticated", message);

export const forbidden = (message = "You do not have permission to do this.") =>
  new HttpError(403, "forbidden", message);

export const notFound = (what = "Resource") => new HttpError(404, "not_found", `${what} not found.`);

export const conflict = (message: string, details?: ErrorDetails) =>
  new HttpError(409, "conflict", message, details);

export const gone = (message: string) => new HttpError(410, "gone", message);

export const payloadTooLarge = (message: string) => new HttpError(413, "payload_too_large", message);

export const tooManyRequests = (message = "Too many attempts. Wait a minute and try again.") =>
  new HttpError(429, "rate_limited", message);

export const serviceUnavailable = (message = "The database is not reachable right now. Nothing was saved; try again shortly.") =>
  new HttpError(503, "service_unavailable", message);
