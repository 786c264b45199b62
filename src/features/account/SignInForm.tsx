import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { Link, useNavigate } from "react-router-dom";
import { SignInSchema, type SignIn } from "@shared/schemas/auth";
import { useResendVerification, useSignIn } from "../../api/auth";
import { ApiError } from "../../api/client";
import { Alert } from "../../components/Alert";
import { Button } from "../../components/Button";
import { FormAlert } from "./FormAlert";
import { showServerErrors } from "./formErrors";
import { linkClass } from "./AuthCard";
import { TextField } from "./TextField";

export function SignInForm({ next, defaultEmail = "" }: { next: string; defaultEmail?: string }) {
  const navigate = useNavigate();
  const signIn = useSignIn();
  const resend = useResendVerification();
  const [unverifiedEmail, setUnverifiedEmail] = useState<string | null>(null);
  const { register, handleSubmit, setError, watch, formState } = useForm<SignIn>({ resolver: zodResolver(SignInSchema), defaultValues: { email: defaultEmail, password: "" } });
  const { errors, isSubmitting } = formState;
  const email = watch("email");

  const onSubmit = handleSubmit(async (values) => {
    setUnverifiedEmail(null);
    try {
      await signIn.mutateAsync(values);
      navigate(next, { replace: true });
    } catch (err) {
      if (err instanceof ApiError && err.code === "email_unverified") setUnverifiedEmail(values.email);
      showServerErrors(err, setError, ["email", "password"]);
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <FormAlert message={errors.root?.server?.message} title={unverifiedEmail ? "Confirm your e-mail address" : "Could not sign in"} kind={unverifiedEmail ? "caution" : "error"} />
      {unverifiedEmail && (
        <div className="-mt-2">
          {resend.isSuccess ? (
            <Alert kind="success" title="Link sent">
              {resend.data.message}
            </Alert>
          ) : (
            <Button variant="secondary" size="sm" disabled={resend.isPending} onClick={() => resend.mutate({ email: unverifiedEmail })}>
              {resend.isPending ? "Sending…" : "Send a new confirmation link"}
            </Button>
          )}
        </div>
      )}
      <TextField label="E-mail" type="email" autoComplete="email" autoFocus={!defaultEmail} registration={register("email")} error={errors.email?.message} />
      <TextField label="Password" type="password" autoComplete="current-password" autoFocus={!!defaultEmail} registration={register("password")} error={errors.password?.message} />
      <div className="flex items-center justify-between gap-3">
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? "Signing in…" : "Sign in"}
        </Button>
        <Link className={linkClass} to={`/forgot-password${email ? `?email=${encodeURIComponent(email)}` : ""}`}>
          Forgot your password?
        </Link>
      </div>
    </form>
  );
}
