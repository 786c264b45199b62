import { useState } from "react";
import { CreateShareSchema, type CreatedShare, type ShareItemType } from "@shared/schemas/shares";
import { ApiError } from "../../api/client";
import { useCreateShare } from "../../api/shares";
import { Alert } from "../../components/Alert";
import { Button } from "../../components/Button";
import { Field, fieldProps, inputClass } from "../../components/Field";
import { EXPIRY_CHOICES, expiryFrom, type ExpiryChoice } from "./shareWords";

/** Shares the item with one e-mail address: the guest signs in with it and sees only this item. */
export function InviteGuestForm({ labId, itemType, itemId }: { labId: string; itemType: ShareItemType; itemId: string }) {
  const create = useCreateShare(labId);
  const [email, setEmail] = useState("");
  const [message, setMessage] = useState("");
  const [expiry, setExpiry] = useState<ExpiryChoice>("90");
  const [made, setMade] = useState<CreatedShare | null>(null);
  const [checked, setChecked] = useState<Record<string, string>>({});
  const fields = { ...(create.error instanceof ApiError ? create.error.fieldMessages() : {}), ...checked };
  const submit = async (e: React.FormEvent) => {
    e.preventDefault();
    // The same schema the server applies, so the address is refused here with the same words.
    const body = CreateShareSchema.safeParse({ kind: "guest", itemType, itemId, email, message, expiresAt: expiryFrom(expiry) });
    setChecked(body.success ? {} : Object.fromEntries(body.error.issues.map((i) => [i.path.join("."), i.message])));
    if (!body.success) return;
    const result = await create.mutateAsync(body.data).catch(() => null);
    setMade(result);
    if (result) setEmail("");
  };
  return (
    <form onSubmit={submit} noValidate className="space-y-3">
      <Field label="Collaborator's e-mail address" error={fields.email} hint="They sign in (or sign up) with this address to open the item. They see nothing else of the lab.">
        {(p) => <input {...fieldProps(p)} type="email" autoComplete="email" className={inputClass} value={email} onChange={(e) => setEmail(e.target.value)} />}
      </Field>
      <div className="grid gap-3 sm:grid-cols-2">
        <Field label="Access lasts" error={fields.expiresAt}>
          {(p) => (
            <select {...fieldProps(p)} className={inputClass} value={expiry} onChange={(e) => setExpiry(e.target.value as ExpiryChoice)}>
              {EXPIRY_CHOICES.map((c) => (
                <option key={c.value} value={c.value}>
                  {c.label}
                </option>
              ))}
            </select>
          )}
        </Field>
        <Field label="Message in the e-mail (optional)" error={fields.message}>
          {(p) => <input {...fieldProps(p)} className={inputClass} value={message} maxLength={500} onChange={(e) => setMessage(e.target.value)} />}
        </Field>
      </div>
      {create.isError && !Object.keys(fields).length && <Alert kind="error" title="Not shared">{create.error.message}</Alert>}
      <Button type="submit" disabled={create.isPending}>
        {create.isPending ? "Sharing…" : "Share by e-mail"}
      </Button>
      {made && (
        <Alert kind={made.mail?.sent ? "success" : "caution"} title={made.mail?.sent ? "Shared and e-mailed" : "Shared, but the e-mail was not sent"}>
          {made.mail?.sent ? `${made.share.email} got an e-mail with the link.` : `${made.mail?.error ?? "The e-mail could not be sent."} ${made.share.email} can still open it under “Shared with me” after signing in.`}
        </Alert>
      )}
    </form>
  );
}
