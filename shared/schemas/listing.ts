import { z } from "zod";
import { LIMITS } from "../limits";

/**
 * The shape every list endpoint shares: `?page=1&pageSize=25&sort=createdAt&order=desc&q=…`
 * in, `{ data, page: { number, size, total } }` out. Pages are 1-based.
 */
export const PageQuerySchema = z.object({
  page: z.coerce.number().int("Page must be a whole number.").min(1, "Page numbers start at 1.").default(1),
  pageSize: z.coerce
    .number()
    .int("Page size must be a whole number.")
    .min(1, "Page size must be at least 1.")
    .max(LIMITS.pageSizeMax, `Page size is at most ${LIMITS.pageSizeMax}.`)
    .default(LIMITS.pageSizeDefault),
  order: z.enum(["asc", "desc"], "Order is asc or desc.").default("desc"),
  q: z.string().trim().max(LIMITS.searchLength, `Search text is at most ${LIMITS.searchLength} characters.`).optional(),
});

/** Adds the sortable columns of one resource to the shared page query. */
export function listQuery<const S extends readonly [string, ...string[]]>(sortable: S, defaultSort: S[number]) {
  return PageQuerySchema.extend({
    sort: z.enum(sortable, `Sort by one of: ${sortable.join(", ")}.`).default(defaultSort as never),
  });
}

export const PageInfoSchema = z.object({ number: z.number().int(), size: z.number().int(), total: z.number().int() });
export type PageInfo = z.infer<typeof PageInfoSchema>;

export function pageOf<T extends z.ZodType>(item: T) {
  return z.object({ data: z.array(item), page: PageInfoSchema });
}

export const UuidSchema = (what: string) => z.string().uuid(`${what} must be a UUID.`);

/** Who did something, as the API shows it (never an e-mail address). */
export const PersonRefSchema = z.object({ id: z.string().uuid(), displayName: z.string() }).nullable();
export type PersonRef = z.infer<typeof PersonRefSchema>;

/** A number (zod 4 rejects ±Infinity and NaN); `what` names the field in the message. */
export const numberField = (what: string) => z.number(`${what} must be a number.`);
