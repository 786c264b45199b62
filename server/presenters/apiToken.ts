import type { ApiTokenDto } from "@shared/schemas/apiTokens";
import type { ApiToken } from "../entities/ApiToken";
import type { Lab } from "../entities/Lab";
import { tokenStatus } from "../services/apiTokens";

/** Never includes the secret or its hash. */
export function presentApiToken(token: ApiToken, lab: Lab | undefined = token.lab): ApiTokenDto {
  return {
    id: token.id,
    name: token.name,
    lab: { id: token.labId, name: lab?.name ?? "" },
    hint: `${token.hint}…`,
    createdAt: token.createdAt.toISOString(),
    lastUsedAt: token.lastUsedAt?.toISOString() ?? null,
    expiresAt: token.expiresAt?.toISOString() ?? null,
    revokedAt: token.revokedAt?.toISOString() ?? null,
    status: tokenStatus(token),
  };
}
