import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { EmailOnlySchema, type EmailOnly } from "@shared/schemas/auth";
import { useRequestPasswordReset } from "../../api/auth";
import { Alert } from "../../components/Alert";
import { Button } from "../../components/Button";
import { FormAlert } from "./FormAlert";
import { showServerErrors } from "./formErrors";
import { OutboxHint } from "./OutboxHint";
import { TextField } from "./TextField";

export function ForgotPasswordForm({ defaultEmail }: { defaultEmail: string }) {
  const request = useRequestPasswordReset();
  const { register, handleSubmit, setError, formState } = useForm<EmailOnly>({ resolver: zodResolver(EmailOnlySchema), defaultValues: { email: defaultEmail } });
  const { errors, isSubmitting } = formState;
  const onSubmit = handleSubmit(async (values) => {
    try {
      await request.mutateAsync(values);
    } catch (err) {
      showServerErrors(err, setError, ["email"]);
    }
  });

  if (request.isSuccess) {
    return (
      <div className="space-y-4">
        <Alert kind="success" title="Check your inbox">
          {request.data.message}
        </Alert>
        <OutboxHint />
      </div>
    );
  }
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <FormAlert message={errors.root?.server?.message} />
      <TextField label="E-mail of your account" type="email" autoComplete="email" autoFocus registration={register("email")} error={errors.email?.message} />
      <Button type="submit" disabled={isSubmitting}>
        {isSubmitting ? "Sending…" : "Send me a link"}
      </Button>
    </form>
  );
}
