import { ChangePasswordSchema, MeSchema, UpdateAccountSchema } from "@shared/schemas/auth";
import { ApiRouter } from "../http/endpoint";
import { presentMe } from "../presenters/me";
import { changePassword, updateDisplayName } from "../services/auth";

/** The signed-in person's own account. */
export const accountRouter = new ApiRouter("/account");
const tags = ["account"];

accountRouter.patch("/", { summary: "Change your display name", auth: "user", tags, body: UpdateAccountSchema, response: MeSchema }, async ({ user, body }) =>
  presentMe(await updateDisplayName(user.id, body.displayName)),
);

accountRouter.post("/password", { summary: "Change your password (signs out your other browsers)", auth: "user", tags, body: ChangePasswordSchema }, async ({ req, user, body }) => {
  await changePassword(user.id, body, req.sessionID);
  return undefined;
});
