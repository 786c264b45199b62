import type { ZodError, ZodType, z } from "zod";

export interface FieldIssue extends Record<string, unknown> {
  field: string;
  message: string;
}

/** Zod issues → [{ field: "rows.3.counts", message }], the details of an "invalid" error. */
export function zodDetails(err: ZodError): FieldIssue[] {
  return err.issues.map((issue) => ({
    field: issue.path.length ? issue.path.map(String).join(".") : "(body)",
    message: issue.message,
  }));
}

/** Parses untrusted input with a shared schema; a ZodError becomes a 400 in the error middleware. */
export function parse<S extends ZodType>(schema: S, input: unknown): z.infer<S> {
  return schema.parse(input);
}
