import { createHash, randomBytes } from "node:crypto";

/**
 * Secrets for one-time e-mailed links: 32 random bytes (base64url) in the link, only their
 * SHA-256 in the database — a fast hash is enough for a random 256-bit secret (unlike passwords).
 */
export function newLinkToken(): { token: string; sha256: string } {
  const token = randomBytes(32).toString("base64url");
  return { token, sha256: hashLinkToken(token) };
}

export function hashLinkToken(token: string): string {
  return createHash("sha256").update(token, "utf8").digest("hex");
}

export const hoursFromNow = (hours: number) => new Date(Date.now() + hours * 3600_000);
