import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { Link } from "react-router-dom";
import { PASSWORD_HINT, SignUpSchema, type SignUp } from "@shared/schemas/auth";
import { useSignUp } from "../../api/auth";
import { Alert } from "../../components/Alert";
import { Button } from "../../components/Button";
import { FormAlert } from "./FormAlert";
import { showServerErrors } from "./formErrors";
import { linkClass } from "./AuthCard";
import { OutboxHint } from "./OutboxHint";
import { TextField } from "./TextField";

export function SignUpForm() {
  const signUp = useSignUp();
  const { register, handleSubmit, setError, formState } = useForm<SignUp>({ resolver: zodResolver(SignUpSchema), defaultValues: { email: "", displayName: "", password: "" } });
  const { errors, isSubmitting } = formState;

  const onSubmit = handleSubmit(async (values) => {
    try {
      await signUp.mutateAsync(values);
    } catch (err) {
      showServerErrors(err, setError, ["email", "displayName", "password"]);
    }
  });

  if (signUp.isSuccess) {
    return (
      <div className="space-y-4">
        <Alert kind={signUp.data.verificationSent ? "success" : "caution"} title={signUp.data.verificationSent ? "Check your inbox" : "Account created, e-mail not sent"}>
          {signUp.data.message}
        </Alert>
        <OutboxHint />
        <p className="text-sm text-ink-soft">
          Already confirmed? <Link className={linkClass} to={`/sign-in?email=${encodeURIComponent(signUp.data.email)}`}>Sign in</Link>
        </p>
      </div>
    );
  }

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <FormAlert message={errors.root?.server?.message} title="Could not create the account" />
      <TextField label="Your name" hint="As colleagues in your labs will see it." autoComplete="name" autoFocus registration={register("displayName")} error={errors.displayName?.message} />
      <TextField label="E-mail" type="email" autoComplete="email" hint="We send a link to confirm it." registration={register("email")} error={errors.email?.message} />
      <TextField label="Password" type="password" autoComplete="new-password" hint={PASSWORD_HINT} registration={register("password")} error={errors.password?.message} />
      <Button type="submit" disabled={isSubmitting}>
        {isSubmitting ? "Creating your account…" : "Create account"}
      </Button>
    </form>
  );
}
