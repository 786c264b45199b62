import { ApiTokenIdParamsSchema, ApiTokenListSchema, ApiTokenSchema, CreateApiTokenSchema, CreatedApiTokenSchema, CurrentCredentialsSchema } from "@shared/schemas/apiTokens";
import { ApiRouter } from "../http/endpoint";
import { presentApiToken } from "../presenters/apiToken";
import { createApiToken, findApiToken, listApiTokens, revokeApiToken } from "../services/apiTokens";

/**
 * The caller's personal API tokens. Managed from a signed-in browser only: a token cannot mint or
 * revoke tokens (these endpoints do not set tokenAccess).
 */
export const apiTokensRouter = new ApiRouter("/tokens");

apiTokensRouter.get("/", { summary: "Your personal API tokens (never their secrets)", auth: "user", tags: ["tokens"], response: ApiTokenListSchema }, async ({ user }) => {
  const tokens = await listApiTokens(user);
  return { data: tokens.map((t) => presentApiToken(t)) };
});

apiTokensRouter.get(
  "/current",
  { summary: "Whom this request's credentials stand for: the person and, with a token, the token and its lab", auth: "user", tokenAccess: true, tags: ["tokens"], response: CurrentCredentialsSchema },
  async ({ user }) => ({ user: { id: user.id, displayName: user.displayName }, token: user.token ? presentApiToken(await findApiToken(user.token.id)) : null }),
);

apiTokensRouter.post(
  "/",
  { summary: "Create a personal API token for one lab; the secret is in this answer only", auth: "user", tags: ["tokens"], body: CreateApiTokenSchema, response: CreatedApiTokenSchema, status: 201 },
  async ({ user, body }) => {
    const { token, lab, secret } = await createApiToken(user, body);
    return { ...presentApiToken(token, lab), secret };
  },
);

apiTokensRouter.delete("/:tokenId", { summary: "Revoke one of your tokens (it stops working at once)", auth: "user", tags: ["tokens"], params: ApiTokenIdParamsSchema, response: ApiTokenSchema }, async ({ user, params }) => {
  return presentApiToken(await revokeApiToken(user, params.tokenId));
});
