import { IsNull, type EntityManager } from "typeorm";
import type { ChangePassword, ResetPassword, SignUp, SignUpResult } from "@shared/schemas/auth";
import { db } from "../db/dataSource";
import { EmailToken, type EmailTokenPurpose } from "../entities/EmailToken";
import { User } from "../entities/User";
import { HttpError, conflict, gone, invalid } from "../http/errors";
import { sendMail } from "../mail/mailer";
import { passwordResetMail, verificationMail } from "../mail/templates";
import { logger } from "../logger";
import { hashLinkToken, hoursFromNow, newLinkToken } from "./linkTokens";
import { hashPassword, passwordMatches } from "./passwords";

export const VERIFY_HOURS = 48;
export const RESET_MINUTES = 60;

/** The one answer for "no such user" and "wrong password" (same status, code and words). */
export const badCredentials = () => new HttpError(401, "bad_credentials", "That e-mail and password do not match an account.");

export const emailTaken = (email: string) =>
  conflict(`An account with the e-mail ${email} already exists. Sign in, or reset the password if you forgot it.`, [
    { field: "email", message: "An account with this e-mail already exists. Sign in, or reset the password if you forgot it." },
  ]);

const isUniqueViolation = (err: unknown) => (err as { code?: string; driverError?: { code?: string } })?.code === "23505" || (err as { driverError?: { code?: string } })?.driverError?.code === "23505";

/** Creates an unverified account and e-mails the confirmation link (after the commit). */
export async function signUp(input: SignUp): Promise<SignUpResult> {
  const email = input.email.toLowerCase();
  const passwordHash = await hashPassword(input.password);
  let token: string;
  try {
    token = await db().transaction(async (em) => {
      if (await em.existsBy(User, { email })) throw emailTaken(email);
      const user = await em.save(em.create(User, { email, displayName: input.displayName, passwordHash, emailVerifiedAt: null }));
      return issueEmailToken(em, user.id, "verify-email", VERIFY_HOURS);
    });
  } catch (err) {
    // Two sign-ups racing for one address: the unique index decides, with the same clear answer.
    if (isUniqueViolation(err)) throw emailTaken(email);
    throw err;
  }
  const mail = await sendMail(verificationMail(email, input.displayName, token, VERIFY_HOURS));
  return {
    email,
    verificationSent: mail.sent,
    message: mail.sent
      ? `We sent a confirmation link to ${email}. Open it to finish signing up; it works for ${VERIFY_HOURS} hours.`
      : `Your account is created, but the confirmation e-mail could not be sent (${mail.error}). Ask for a new link from the sign-in page later.`,
  };
}

/** Checks e-mail and password; an unconfirmed address is told only to someone who knows the password. */
export async function authenticate(emailInput: string, password: string): Promise<User> {
  const user = await db().getRepository(User).findOneBy({ email: emailInput.trim().toLowerCase() });
  const ok = await passwordMatches(password, user?.passwordHash);
  if (!user || !ok) throw badCredentials();
  if (!user.emailVerifiedAt) {
    throw new HttpError(403, "email_unverified", `Confirm your e-mail address first: open the link we sent to ${user.email}. No e-mail? Ask for a new link below.`);
  }
  return user;
}

/** Consumes a confirmation link and marks the address confirmed. */
export async function verifyEmail(token: string): Promise<User> {
  return db().transaction(async (em) => {
    const row = await consumeEmailToken(em, token, "verify-email", "confirmation");
    const user = await em.findOneByOrFail(User, { id: row.userId });
    user.emailVerifiedAt ??= new Date();
    return em.save(user);
  });
}

export const RESEND_NOTICE = "If an account with that address is waiting for confirmation, a new link is on its way.";

/** Same answer whether or not the account exists; mail goes out in the background. */
export async function resendVerification(emailInput: string): Promise<void> {
  const email = emailInput.trim().toLowerCase();
  const result = await db().transaction(async (em) => {
    const user = await em.findOneBy(User, { email });
    if (!user || user.emailVerifiedAt) return null;
    return { user, token: await issueEmailToken(em, user.id, "verify-email", VERIFY_HOURS) };
  });
  if (result) void sendMail(verificationMail(email, result.user.displayName, result.token, VERIFY_HOURS));
}

export const RESET_NOTICE = `If an account with that address exists, a link to choose a new password is on its way. It works for ${RESET_MINUTES} minutes.`;

/** Same answer and the same time whether or not the account exists: the mail is not awaited. */
export async function requestPasswordReset(emailInput: string): Promise<void> {
  const email = emailInput.trim().toLowerCase();
  const result = await db().transaction(async (em) => {
    const user = await em.findOneBy(User, { email });
    if (!user) return null;
    return { user, token: await issueEmailToken(em, user.id, "reset-password", RESET_MINUTES / 60) };
  });
  if (result) void sendMail(passwordResetMail(email, result.user.displayName, result.token, RESET_MINUTES));
}

/** Sets the new password, uses up every reset link of the account and signs out its other sessions. */
export async function resetPassword(input: ResetPassword): Promise<User> {
  const passwordHash = await hashPassword(input.password);
  return db().transaction(async (em) => {
    const row = await consumeEmailToken(em, input.token, "reset-password", "password reset");
    const user = await em.findOneByOrFail(User, { id: row.userId });
    user.passwordHash = passwordHash;
    user.emailVerifiedAt ??= new Date(); // the link proves the address
    await em.update(EmailToken, { userId: user.id, purpose: "reset-password", usedAt: IsNull() }, { usedAt: new Date() });
    await endSessionsOf(em, user.id);
    return em.save(user);
  });
}

export async function updateDisplayName(userId: string, displayName: string): Promise<User> {
  return db().transaction(async (em) => {
    const user = await em.findOneByOrFail(User, { id: userId });
    user.displayName = displayName;
    return em.save(user);
  });
}

/** Needs the current password; keeps this browser signed in and signs out every other one. */
export async function changePassword(userId: string, input: ChangePassword, keepSessionId: string): Promise<void> {
  const user = await db().getRepository(User).findOneByOrFail({ id: userId });
  if (!(await passwordMatches(input.currentPassword, user.passwordHash))) throw invalid("currentPassword", "That is not your current password.");
  if (input.newPassword === input.currentPassword) throw invalid("newPassword", "Choose a password different from the current one.");
  const passwordHash = await hashPassword(input.newPassword);
  await db().transaction(async (em) => {
    await em.update(User, { id: userId }, { passwordHash });
    await endSessionsOf(em, userId, keepSessionId);
  });
  logger.info({ userId }, "password changed; other sessions ended");
}

async function endSessionsOf(em: EntityManager, userId: string, exceptSessionId = ""): Promise<void> {
  await em.query(`DELETE FROM http_sessions WHERE sess->>'userId' = $1 AND sid <> $2`, [userId, exceptSessionId]);
}

async function issueEmailToken(em: EntityManager, userId: string, purpose: EmailTokenPurpose, hours: number): Promise<string> {
  const { token, sha256 } = newLinkToken();
  await em.save(em.create(EmailToken, { userId, purpose, tokenSha256: sha256, expiresAt: hoursFromNow(hours), usedAt: null }));
  return token;
}

/** Locks and uses up one link; unknown → 404, used or expired → 410 with what to do next. */
async function consumeEmailToken(em: EntityManager, token: string, purpose: EmailTokenPurpose, what: string): Promise<EmailToken> {
  const row = await em.findOne(EmailToken, { where: { tokenSha256: hashLinkToken(token), purpose }, lock: { mode: "pessimistic_write" } });
  if (!row) throw new HttpError(404, "not_found", `This ${what} link is not valid: copy the whole link from the e-mail, or ask for a new one.`);
  const again = purpose === "verify-email" ? "Sign in, or ask for a new confirmation link from the sign-in page." : "Ask for a new one on the “Forgot your password?” page.";
  if (row.usedAt) throw gone(`This ${what} link was already used. ${again}`);
  if (row.expiresAt.getTime() < Date.now()) throw gone(`This ${what} link expired on ${row.expiresAt.toUTCString()}. ${again}`);
  row.usedAt = new Date();
  return em.save(row);
}
