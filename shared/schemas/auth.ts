import { z } from "zod";
import { LIMITS } from "../limits";

export const EmailSchema = z.string().trim().min(1, "Enter your e-mail address.").max(LIMITS.emailLength).email("Enter a valid e-mail address, like name@example.org.");

/**
 * The password rules, said exactly where they are checked: at least 10 characters and at most
 * 72 bytes (bcrypt ignores anything after byte 72), not only spaces, and not the e-mail address.
 * No composition rules: length matters more (NIST SP 800-63B, 2017, §5.1.1.2).
 */
export const PASSWORD_RULES = { minLength: 10, maxBytes: 72 } as const;
export const PASSWORD_HINT = `At least ${PASSWORD_RULES.minLength} characters (at most ${PASSWORD_RULES.maxBytes} bytes); a few unrelated words make a good one.`;

export const NewPasswordSchema = z
  .string()
  .min(PASSWORD_RULES.minLength, `The password needs at least ${PASSWORD_RULES.minLength} characters.`)
  .refine((p) => new TextEncoder().encode(p).length <= PASSWORD_RULES.maxBytes, `The password can be at most ${PASSWORD_RULES.maxBytes} bytes long (about ${PASSWORD_RULES.maxBytes} plain letters).`)
  .refine((p) => p.trim().length > 0, "The password cannot be only spaces.");

export const DisplayNameSchema = z.string().trim().min(1, "Enter your name as colleagues should see it.").max(LIMITS.nameLength, `At most ${LIMITS.nameLength} characters.`);

/** A one-time token from an e-mailed link (verification, password reset, invitation). */
export const LinkTokenSchema = z.string().trim().min(20, "This link is incomplete: copy the whole link from the e-mail.").max(200, "This link is not one of ours.");

const notTheEmail = (v: { email: string; password: string }) => v.password.trim().toLowerCase() !== v.email.trim().toLowerCase();

export const SignInSchema = z.object({
  email: EmailSchema,
  password: z.string().min(1, "Enter your password.").max(LIMITS.passwordLength),
});
export type SignIn = z.infer<typeof SignInSchema>;

export const SignUpSchema = z
  .object({ email: EmailSchema, displayName: DisplayNameSchema, password: NewPasswordSchema })
  .refine(notTheEmail, { path: ["password"], message: "The password cannot be your e-mail address." });
export type SignUp = z.infer<typeof SignUpSchema>;

export const SignUpResultSchema = z.object({ email: z.string(), verificationSent: z.boolean(), message: z.string() });
export type SignUpResult = z.infer<typeof SignUpResultSchema>;

export const EmailOnlySchema = z.object({ email: EmailSchema });
export type EmailOnly = z.infer<typeof EmailOnlySchema>;

export const VerifyEmailSchema = z.object({ token: LinkTokenSchema });

export const ResetPasswordSchema = z.object({ token: LinkTokenSchema, password: NewPasswordSchema });
export type ResetPassword = z.infer<typeof ResetPasswordSchema>;

/** An answer that is only a sentence to show, e.g. "If an account exists, we sent a link". */
export const NoticeSchema = z.object({ message: z.string() });
export type Notice = z.infer<typeof NoticeSchema>;

export const UpdateAccountSchema = z.object({ displayName: DisplayNameSchema });
export type UpdateAccount = z.infer<typeof UpdateAccountSchema>;

export const ChangePasswordSchema = z.object({
  currentPassword: z.string().min(1, "Enter your current password.").max(LIMITS.passwordLength),
  newPassword: NewPasswordSchema,
});
export type ChangePassword = z.infer<typeof ChangePasswordSchema>;

export const MeSchema = z.object({
  id: z.string().uuid(),
  email: z.string(),
  displayName: z.string(),
  emailVerified: z.boolean(),
});
export type Me = z.infer<typeof MeSchema>;

/** GET /api/auth/csrf-token: the value to send back in the X-CSRF-Token header of every write. */
export const CsrfTokenSchema = z.object({ token: z.string() });
