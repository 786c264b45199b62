import { createHash, randomBytes } from "node:crypto";
import { IsNull } from "typeorm";
import { API_TOKEN_PREFIX, type CreateApiToken } from "@shared/schemas/apiTokens";
import { db } from "../db/dataSource";
import { ApiToken } from "../entities/ApiToken";
import { Lab } from "../entities/Lab";
import type { AuthUser } from "../http/auth";
import { HttpError, notFound } from "../http/errors";
import { authorizeLab } from "../policies/labAccess";

/**
 * Why SHA-256 and not bcrypt: the secret is 32 random bytes (256 bits), so no one can guess it or
 * try candidates against a stolen hash — the slow, salted hashes used for passwords exist to make
 * guessing low-entropy secrets expensive, which is moot here. A plain SHA-256 also lets each API
 * request find its token with one indexed equality lookup instead of a ~100 ms hash comparison.
 */
export function hashSecret(secret: string): string {
  return createHash("sha256").update(secret, "utf8").digest("hex");
}

const HINT_LENGTH = API_TOKEN_PREFIX.length + 6;
/** Writing last_used_at on every request would turn each read into a write; once a minute is enough. */
const LAST_USED_RESOLUTION_MS = 60_000;

/** Creates a token for a lab where the caller may write (tokens post runs); returns the secret once. */
export async function createApiToken(user: AuthUser, input: CreateApiToken): Promise<{ token: ApiToken; lab: Lab; secret: string }> {
  await authorizeLab(user, input.labId, "write");
  const secret = API_TOKEN_PREFIX + randomBytes(32).toString("base64url");
  const expiresAt = input.expiresInDays ? new Date(Date.now() + input.expiresInDays * 86_400_000) : null;
  const repo = db().getRepository(ApiToken);
  const token = await repo.save(
    repo.create({ userId: user.id, labId: input.labId, name: input.name, secretSha256: hashSecret(secret), hint: secret.slice(0, HINT_LENGTH), expiresAt, lastUsedAt: null, revokedAt: null }),
  );
  const lab = await db().getRepository(Lab).findOneByOrFail({ id: input.labId });
  return { token, lab, secret };
}

/** The caller's tokens, newest first, with their labs. */
export async function listApiTokens(user: AuthUser): Promise<ApiToken[]> {
  return db().getRepository(ApiToken).find({ where: { userId: user.id }, relations: { lab: true }, order: { createdAt: "DESC" } });
}

export async function findApiToken(id: string): Promise<ApiToken> {
  return db().getRepository(ApiToken).findOneOrFail({ where: { id }, relations: { lab: true } });
}

/** Revokes one of the caller's own tokens (again is harmless); it stops working at once. */
export async function revokeApiToken(user: AuthUser, tokenId: string): Promise<ApiToken> {
  const repo = db().getRepository(ApiToken);
  const token = await repo.findOne({ where: { id: tokenId, userId: user.id }, relations: { lab: true } });
  if (!token) throw notFound("Token");
  if (!token.revokedAt) {
    await repo.update({ id: token.id, revokedAt: IsNull() }, { revokedAt: new Date() });
    return repo.findOneOrFail({ where: { id: token.id }, relations: { lab: true } });
  }
  return token;
}

export const invalidToken = (why: string) => new HttpError(401, "token_invalid", `This API token ${why}. Create a new one on the API tokens page.`);

/** The caller behind a Bearer secret, or a 401 saying why the token does not work. */
export async function authenticateToken(secret: string): Promise<AuthUser> {
  const token = await db().getRepository(ApiToken).findOne({ where: { secretSha256: hashSecret(secret) }, relations: { user: true } });
  if (!token || !token.user) throw invalidToken("is not known");
  if (token.revokedAt) throw invalidToken("was revoked");
  const now = Date.now();
  if (token.expiresAt && token.expiresAt.getTime() <= now) throw invalidToken("has expired");
  if (!token.lastUsedAt || now - token.lastUsedAt.getTime() > LAST_USED_RESOLUTION_MS) {
    await db().getRepository(ApiToken).update({ id: token.id }, { lastUsedAt: new Date(now) });
  }
  const { user } = token;
  return { id: user.id, email: user.email, displayName: user.displayName, token: { id: token.id, labId: token.labId } };
}

export function tokenStatus(token: ApiToken, now = Date.now()): "active" | "expired" | "revoked" {
  if (token.revokedAt) return "revoked";
  if (token.expiresAt && token.expiresAt.getTime() <= now) return "expired";
  return "active";
}
