import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { Link, useNavigate } from "react-router-dom";
import { PASSWORD_HINT, ResetPasswordSchema, type ResetPassword } from "@shared/schemas/auth";
import { useResetPassword } from "../../api/auth";
import { ApiError } from "../../api/client";
import { Alert } from "../../components/Alert";
import { Button } from "../../components/Button";
import { FormAlert } from "./FormAlert";
import { showServerErrors } from "./formErrors";
import { linkClass } from "./AuthCard";
import { TextField } from "./TextField";

export function ResetPasswordForm({ token }: { token: string }) {
  const navigate = useNavigate();
  const reset = useResetPassword();
  const { register, handleSubmit, setError, formState } = useForm<ResetPassword>({ resolver: zodResolver(ResetPasswordSchema), defaultValues: { token, password: "" } });
  const { errors, isSubmitting } = formState;
  const onSubmit = handleSubmit(async (values) => {
    try {
      await reset.mutateAsync(values);
      navigate("/", { replace: true });
    } catch (err) {
      showServerErrors(err, setError, ["password"]);
    }
  });

  // A used, expired or broken link cannot be fixed by typing: say so and offer a new one.
  if (reset.error instanceof ApiError && (reset.error.status === 410 || reset.error.status === 404)) {
    return (
      <Alert kind="error" title="This link cannot be used">
        {reset.error.message} <Link className={linkClass} to="/forgot-password">Get a new link</Link>
      </Alert>
    );
  }
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <FormAlert message={errors.root?.server?.message ?? errors.token?.message} />
      <TextField label="New password" type="password" autoComplete="new-password" autoFocus hint={PASSWORD_HINT} registration={register("password")} error={errors.password?.message} />
      <p className="text-sm text-ink-soft">Saving signs you in here and signs you out everywhere else.</p>
      <Button type="submit" disabled={isSubmitting}>
        {isSubmitting ? "Saving…" : "Save the new password"}
      </Button>
    </form>
  );
}
