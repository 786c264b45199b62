import {
  CsrfTokenSchema,
  EmailOnlySchema,
  MeSchema,
  NoticeSchema,
  ResetPasswordSchema,
  SignInSchema,
  SignUpResultSchema,
  SignUpSchema,
  VerifyEmailSchema,
} from "@shared/schemas/auth";
import { db } from "../db/dataSource";
import { User } from "../entities/User";
import { ApiRouter } from "../http/endpoint";
import { issueCsrfToken } from "../http/csrf";
import { mailRequestLimit, signInLimit, signUpLimit } from "../http/rateLimit";
import { regenerateSession, saveSession, startSignedInSession } from "../http/session";
import { presentMe } from "../presenters/me";
import { RESEND_NOTICE, RESET_NOTICE, authenticate, requestPasswordReset, resendVerification, resetPassword, signUp, verifyEmail } from "../services/auth";

/** Sign-up, e-mail confirmation, sign-in, sign-out, password reset and "who am I". */
export const authRouter = new ApiRouter("/auth");
const tags = ["auth"];

// Rate limits run before the handlers they guard.
authRouter.router.post("/sign-in", signInLimit);
authRouter.router.post("/sign-up", signUpLimit);
authRouter.router.post(["/resend-verification", "/password-reset"], mailRequestLimit);

authRouter.get("/csrf-token", { summary: "The security token to send in the X-CSRF-Token header of every write", auth: "public", tags, response: CsrfTokenSchema }, async ({ req, res }) => {
  const token = issueCsrfToken(req, res);
  await saveSession(req);
  return { token };
});

authRouter.post("/sign-up", { summary: "Create an account; a confirmation link is e-mailed", auth: "public", tags, body: SignUpSchema, response: SignUpResultSchema, status: 201 }, async ({ body }) => signUp(body));

authRouter.post("/verify-email", { summary: "Confirm the e-mail address with the e-mailed link, and sign in", auth: "public", tags, body: VerifyEmailSchema, response: MeSchema }, async ({ req, res, body }) => {
  const user = await verifyEmail(body.token);
  await startSignedInSession(req, res, user.id);
  return presentMe(user);
});

authRouter.post("/resend-verification", { summary: "E-mail a new confirmation link (same answer whether or not the account exists)", auth: "public", tags, body: EmailOnlySchema, response: NoticeSchema, status: 202 }, async ({ body }) => {
  await resendVerification(body.email);
  return { message: RESEND_NOTICE };
});

authRouter.post("/sign-in", { summary: "Sign in with e-mail and password", auth: "public", tags, body: SignInSchema, response: MeSchema }, async ({ req, res, body }) => {
  const user = await authenticate(body.email, body.password);
  await startSignedInSession(req, res, user.id);
  return presentMe(user);
});

authRouter.post("/sign-out", { summary: "Sign out", auth: "public", tags }, async ({ req, res }) => {
  await regenerateSession(req);
  issueCsrfToken(req, res);
  await saveSession(req);
  return undefined;
});

authRouter.post("/password-reset", { summary: "E-mail a link to choose a new password (same answer whether or not the account exists)", auth: "public", tags, body: EmailOnlySchema, response: NoticeSchema, status: 202 }, async ({ body }) => {
  await requestPasswordReset(body.email);
  return { message: RESET_NOTICE };
});

authRouter.post("/password-reset/confirm", { summary: "Choose a new password with the e-mailed link, and sign in", auth: "public", tags, body: ResetPasswordSchema, response: MeSchema }, async ({ req, res, body }) => {
  const user = await resetPassword(body);
  await startSignedInSession(req, res, user.id);
  return presentMe(user);
});

authRouter.get("/me", { summary: "The signed-in user", auth: "user", tags, response: MeSchema }, async ({ user }) => {
  const entity = await db().getRepository(User).findOneByOrFail({ id: user.id });
  return presentMe(entity);
});
