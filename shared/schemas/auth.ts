import { z } from "zod";
import { LIMITS } from "../limits";

export const EmailSchema = z.string().trim().min(1, "Enter your e-mail address.").max(LIMITS.emailLength).email("Enter a valid e-mail address, like name@example.org.");

export const SignInSchema = z.object({
  email: EmailSchema,
  password: z.string().min(1, "Enter your password.").max(LIMITS.passwordLength),
});
export type SignIn = z.infer<typeof SignInSchema>;

export const MeSchema = z.object({
  id: z.string().uuid(),
  email: z.string(),
  displayName: z.string(),
  emailVerified: z.boolean(),
});
export type Me = z.infer<typeof MeSchema>;

/** GET /api/auth/csrf-token: the value to send back in the X-CSRF-Token header of every write. */
export const CsrfTokenSchema = z.object({ token: z.string() });
