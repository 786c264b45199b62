import bcrypt from "bcryptjs";
import { CsrfTokenSchema, MeSchema, SignInSchema } from "@shared/schemas/auth";
import { db } from "../db/dataSource";
import { User } from "../entities/User";
import { ApiRouter } from "../http/endpoint";
import { issueCsrfToken } from "../http/csrf";
import { HttpError } from "../http/errors";
import { regenerateSession, saveSession } from "../http/session";
import { presentMe } from "../presenters/me";

/** Sign-in, sign-out and "who am I". */
export const authRouter = new ApiRouter("/auth");

// A real hash of a random string, compared when the e-mail is unknown, so "no such user" and
// "wrong password" take the same time and get the same answer.
const DUMMY_HASH = bcrypt.hashSync("rhomb-no-such-user-" + Math.random(), 10);

authRouter.get("/csrf-token", { summary: "The security token to send in the X-CSRF-Token header of every write", auth: "public", tags: ["auth"], response: CsrfTokenSchema }, async ({ req, res }) => {
  const token = issueCsrfToken(req, res);
  await saveSession(req);
  return { token };
});

authRouter.post("/sign-in", { summary: "Sign in with e-mail and password", auth: "public", tags: ["auth"], body: SignInSchema, response: MeSchema }, async ({ req, res, body }) => {
  const user = await db().getRepository(User).findOneBy({ email: body.email.toLowerCase() });
  const ok = await bcrypt.compare(body.password, user?.passwordHash ?? DUMMY_HASH);
  if (!user || !ok) throw new HttpError(401, "bad_credentials", "That e-mail and password do not match an account.");
  await regenerateSession(req);
  req.session.userId = user.id;
  issueCsrfToken(req, res);
  await saveSession(req);
  return presentMe(user);
});

authRouter.post("/sign-out", { summary: "Sign out", auth: "public", tags: ["auth"] }, async ({ req, res }) => {
  await regenerateSession(req);
  issueCsrfToken(req, res);
  await saveSession(req);
  return undefined;
});

authRouter.get("/me", { summary: "The signed-in user and their labs", auth: "user", tags: ["auth"], response: MeSchema }, async ({ user }) => {
  const entity = await db().getRepository(User).findOneByOrFail({ id: user.id });
  return presentMe(entity);
});
