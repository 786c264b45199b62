import { z } from "zod";
import { LIMITS } from "../limits";
import { UuidSchema } from "./listing";

/**
 * Personal API tokens: a secret an acquisition PC sends as `Authorization: Bearer rhb_…` instead
 * of a browser session. Each token belongs to one person and reaches one lab, with that person's
 * current role there. The secret is shown once, when the token is created.
 */
export const API_TOKEN_PREFIX = "rhb_";

export const ApiTokenIdParamsSchema = z.object({ tokenId: UuidSchema("Token id") });

export const CreateApiTokenSchema = z.object({
  name: z.string().trim().min(1, "Name the token after where it is used, e.g. “acquisition PC, table 2”.").max(LIMITS.nameLength, `At most ${LIMITS.nameLength} characters.`),
  labId: UuidSchema("Lab"),
  /** Days until the token stops working; null keeps it until revoked. */
  expiresInDays: z.number("Expiry must be a number of days.").int("Expiry is a whole number of days.").min(1, "Expiry is at least 1 day.").max(LIMITS.apiTokenDaysMax, `Expiry is at most ${LIMITS.apiTokenDaysMax} days.`).nullable().default(null),
});
export type CreateApiToken = z.infer<typeof CreateApiTokenSchema>;

export const ApiTokenSchema = z.object({
  id: z.string().uuid(),
  name: z.string(),
  lab: z.object({ id: z.string().uuid(), name: z.string() }),
  /** The first characters of the secret, so a token can be recognised in a config file. */
  hint: z.string(),
  createdAt: z.string(),
  lastUsedAt: z.string().nullable(),
  expiresAt: z.string().nullable(),
  revokedAt: z.string().nullable(),
  status: z.enum(["active", "expired", "revoked"]),
});
export type ApiTokenDto = z.infer<typeof ApiTokenSchema>;

export const ApiTokenListSchema = z.object({ data: z.array(ApiTokenSchema) });

/** The answer to a create: the token and, this once, its secret. */
export const CreatedApiTokenSchema = ApiTokenSchema.extend({ secret: z.string() });
export type CreatedApiTokenDto = z.infer<typeof CreatedApiTokenSchema>;

/** GET /api/tokens/current: whom the caller's credentials stand for (the CLI asks before uploading). */
export const CurrentCredentialsSchema = z.object({
  user: z.object({ id: z.string().uuid(), displayName: z.string() }),
  /** The API token of this request, or null when a browser session is signed in. */
  token: ApiTokenSchema.nullable(),
});
