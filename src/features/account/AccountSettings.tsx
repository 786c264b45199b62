import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { ChangePasswordSchema, PASSWORD_HINT, UpdateAccountSchema, type ChangePassword, type Me, type UpdateAccount } from "@shared/schemas/auth";
import { useChangePassword, useUpdateAccount } from "../../api/auth";
import { Alert } from "../../components/Alert";
import { Button } from "../../components/Button";
import { Panel } from "../../components/Panel";
import { FormAlert } from "./FormAlert";
import { showServerErrors } from "./formErrors";
import { TextField } from "./TextField";

export function AccountSettings({ me }: { me: Me }) {
  return (
    <div className="grid gap-4 lg:grid-cols-2">
      <Panel title="Your name">
        <NameForm me={me} />
      </Panel>
      <Panel title="Password">
        <PasswordForm />
      </Panel>
    </div>
  );
}

function NameForm({ me }: { me: Me }) {
  const update = useUpdateAccount();
  const { register, handleSubmit, setError, formState } = useForm<UpdateAccount>({ resolver: zodResolver(UpdateAccountSchema), values: { displayName: me.displayName } });
  const { errors, isSubmitting, isDirty } = formState;
  const onSubmit = handleSubmit(async (values) => {
    try {
      await update.mutateAsync(values);
    } catch (err) {
      showServerErrors(err, setError, ["displayName"]);
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-3">
      <FormAlert message={errors.root?.server?.message} title="Could not save" />
      {update.isSuccess && !isDirty && <Alert kind="success" title="Saved">Colleagues now see you as {me.displayName}.</Alert>}
      <TextField label="Display name" autoComplete="name" registration={register("displayName")} error={errors.displayName?.message} />
      <p className="text-sm text-ink-soft">Your e-mail address, {me.email}, is how you sign in.</p>
      <Button type="submit" variant="secondary" disabled={isSubmitting || !isDirty}>
        Save name
      </Button>
    </form>
  );
}

function PasswordForm() {
  const change = useChangePassword();
  const { register, handleSubmit, setError, reset, formState } = useForm<ChangePassword>({ resolver: zodResolver(ChangePasswordSchema), defaultValues: { currentPassword: "", newPassword: "" } });
  const { errors, isSubmitting } = formState;
  const onSubmit = handleSubmit(async (values) => {
    try {
      await change.mutateAsync(values);
      reset();
    } catch (err) {
      showServerErrors(err, setError, ["currentPassword", "newPassword"]);
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-3">
      <FormAlert message={errors.root?.server?.message} title="Password not changed" />
      {change.isSuccess && <Alert kind="success" title="Password changed">You stay signed in here; every other browser was signed out.</Alert>}
      <TextField label="Current password" type="password" autoComplete="current-password" registration={register("currentPassword")} error={errors.currentPassword?.message} />
      <TextField label="New password" type="password" autoComplete="new-password" hint={PASSWORD_HINT} registration={register("newPassword")} error={errors.newPassword?.message} />
      <Button type="submit" variant="secondary" disabled={isSubmitting}>
        {isSubmitting ? "Changing…" : "Change password"}
      </Button>
    </form>
  );
}
