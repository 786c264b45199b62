import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { CreateInvitationSchema, INVITATION_DAYS } from "@shared/schemas/invitations";
import { useCreateInvitation } from "../../api/invitations";
import { Alert } from "../../components/Alert";
import { Button } from "../../components/Button";
import { Field, inputClass } from "../../components/Field";
import { FormAlert } from "../account/FormAlert";
import { showServerErrors } from "../account/formErrors";
import { TextField } from "../account/TextField";
import { ROLE_ORDER, roleWords } from "./roleWords";

/** An owner invites someone by e-mail with a role; the link works once, for a week. */
export function InviteForm({ labId }: { labId: string }) {
  const invite = useCreateInvitation(labId);
  const { register, handleSubmit, setError, reset, watch, formState } = useForm<z.input<typeof CreateInvitationSchema>, unknown, z.output<typeof CreateInvitationSchema>>({
    resolver: zodResolver(CreateInvitationSchema),
    defaultValues: { email: "", role: "member" },
  });
  const { errors, isSubmitting } = formState;
  const role = watch("role") ?? "member";
  const onSubmit = handleSubmit(async (values) => {
    try {
      await invite.mutateAsync(values);
      reset({ email: "", role: values.role });
    } catch (err) {
      showServerErrors(err, setError, ["email", "role"]);
    }
  });
  const result = invite.data;
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-3">
      <FormAlert message={errors.root?.server?.message} title="Could not invite" />
      {result && !isSubmitting && (
        <Alert kind={result.mail.sent ? "success" : "caution"} title={result.mail.sent ? "Invitation sent" : "Invitation saved, e-mail not sent"}>
          {result.mail.sent
            ? `${result.invitation.email} can join as ${roleWords[result.invitation.role].label.toLowerCase()} with the link in the e-mail for ${INVITATION_DAYS} days.`
            : `${result.mail.error ?? "The e-mail could not be sent."} The invitation is listed below; withdraw it and invite again once mail works.`}
        </Alert>
      )}
      <div className="grid gap-3 sm:grid-cols-[1fr_12rem]">
        <TextField label="E-mail address" type="email" autoComplete="off" registration={register("email")} error={errors.email?.message} />
        <Field label="Role" error={errors.role?.message}>
          {({ id, describedBy, invalid }) => (
            <select id={id} aria-describedby={describedBy} aria-invalid={invalid} className={inputClass} {...register("role")}>
              {ROLE_ORDER.map((r) => (
                <option key={r} value={r}>
                  {roleWords[r].label}
                </option>
              ))}
            </select>
          )}
        </Field>
      </div>
      <p className="text-sm text-ink-soft">
        {roleWords[role].label}: {roleWords[role].can}.
      </p>
      <Button type="submit" disabled={isSubmitting}>
        {isSubmitting ? "Sending…" : "Send invitation"}
      </Button>
    </form>
  );
}
