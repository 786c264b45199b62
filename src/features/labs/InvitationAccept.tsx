import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useNavigate } from "react-router-dom";
import { z } from "zod";
import { DisplayNameSchema, NewPasswordSchema, PASSWORD_HINT } from "@shared/schemas/auth";
import { useMe } from "../../api/auth";
import { useAcceptInvitation, useInvitationPreview } from "../../api/invitations";
import { ApiError } from "../../api/client";
import { Alert } from "../../components/Alert";
import { Button, ButtonLink } from "../../components/Button";
import { FormAlert } from "../account/FormAlert";
import { showServerErrors } from "../account/formErrors";
import { TextField } from "../account/TextField";
import { roleWords } from "./roleWords";
import { formatDateTime } from "@shared/format/dates";

const NewAccountSchema = z.object({ displayName: DisplayNameSchema, password: NewPasswordSchema });
type NewAccount = z.infer<typeof NewAccountSchema>;

/**
 * The invitation link: shows the lab and role, then joins it — signed in, with one button;
 * without an account, by choosing a name and password; with an account, after signing in.
 */
export function InvitationAccept({ token }: { token: string }) {
  const preview = useInvitationPreview(token);
  const me = useMe();
  const accept = useAcceptInvitation();
  const navigate = useNavigate();
  const here = `/invitation?token=${encodeURIComponent(token)}`;
  const { register, handleSubmit, setError, formState } = useForm<NewAccount>({ resolver: zodResolver(NewAccountSchema), defaultValues: { displayName: "", password: "" } });
  const { errors, isSubmitting } = formState;

  const join = async (extra: Partial<NewAccount> = {}) => {
    const { lab } = await accept.mutateAsync({ token, ...extra });
    navigate(`/labs/${lab.id}`, { replace: true });
  };
  const onCreate = handleSubmit(async (values) => {
    try {
      await join(values);
    } catch (err) {
      showServerErrors(err, setError, ["displayName", "password"]);
    }
  });

  if (!token) return <Alert kind="error" title="This link is incomplete">Copy the whole link from the e-mail into the address bar.</Alert>;
  if (preview.isPending || me.isPending) return <p role="status" className="text-ink-faint">Opening the invitation…</p>;
  if (preview.isError) {
    const gone = preview.error instanceof ApiError && preview.error.status === 410;
    return (
      <Alert kind="error" title={gone ? "This invitation can no longer be used" : "This invitation link does not work"}>
        {preview.error.message}
      </Alert>
    );
  }
  const inv = preview.data;
  const role = roleWords[inv.role];
  return (
    <div className="space-y-4">
      <p className="text-ink">
        <strong>{inv.invitedBy}</strong> invites <strong>{inv.email}</strong> to <strong>{inv.labName}</strong>
        {inv.institution && ` (${inv.institution})`} as {role.article} <strong>{role.label.toLowerCase()}</strong>: {role.can}.
      </p>
      <p className="text-sm text-ink-faint">The link works once, until {formatDateTime(inv.expiresAt)}.</p>
      {me.data ? (
        <>
          {accept.error && (
            <Alert kind="error" title="Could not join">
              {accept.error.message}
            </Alert>
          )}
          {me.data.email !== inv.email && (
            <Alert kind="caution" title="A different address">
              The invitation went to {inv.email}, and you are signed in as {me.data.email}. Joining adds the lab to the account you are signed in with.
            </Alert>
          )}
          <Button disabled={accept.isPending} onClick={() => void join().catch(() => undefined)}>
            {accept.isPending ? "Joining…" : `Join ${inv.labName}`}
          </Button>
        </>
      ) : inv.accountExists ? (
        <>
          <p className="text-ink-soft">There is already a Rhomb account for {inv.email}. Sign in with it, and you come back here to join.</p>
          <ButtonLink to={`/sign-in?email=${encodeURIComponent(inv.email)}&next=${encodeURIComponent(here)}`}>Sign in to join</ButtonLink>
        </>
      ) : (
        <form onSubmit={onCreate} noValidate className="space-y-4 border-t border-paper-sunk pt-4">
          <p className="text-ink-soft">Create your account for {inv.email} to join. The link already confirms the address.</p>
          <FormAlert message={errors.root?.server?.message} title="Could not join" />
          <TextField label="Your name" autoComplete="name" autoFocus registration={register("displayName")} error={errors.displayName?.message} />
          <TextField label="Password" type="password" autoComplete="new-password" hint={PASSWORD_HINT} registration={register("password")} error={errors.password?.message} />
          <Button type="submit" disabled={isSubmitting}>
            {isSubmitting ? "Joining…" : "Create account and join"}
          </Button>
        </form>
      )}
    </div>
  );
}
