import { useState } from "react";
import type { CreatedShare, ShareItemType } from "@shared/schemas/shares";
import { ApiError } from "../../api/client";
import { useCreateShare } from "../../api/shares";
import { Alert } from "../../components/Alert";
import { Button } from "../../components/Button";
import { Field, fieldProps, inputClass } from "../../components/Field";
import { EXPIRY_CHOICES, expiryFrom, type ExpiryChoice } from "./shareWords";

/** Makes a read-only link; shows it once (only its fingerprint is stored) with a copy button. */
export function CreateLinkForm({ labId, itemType, itemId }: { labId: string; itemType: ShareItemType; itemId: string }) {
  const create = useCreateShare(labId);
  const [expiry, setExpiry] = useState<ExpiryChoice>("30");
  const [label, setLabel] = useState("");
  const [made, setMade] = useState<CreatedShare | null>(null);
  const [copied, setCopied] = useState(false);
  const fields = create.error instanceof ApiError ? create.error.fieldMessages() : {};
  const submit = async (e: React.FormEvent) => {
    e.preventDefault();
    setCopied(false);
    setMade(await create.mutateAsync({ kind: "link", itemType, itemId, expiresAt: expiryFrom(expiry), label }).catch(() => null));
  };
  const copy = async () => {
    await navigator.clipboard.writeText(made!.link!.url);
    setCopied(true);
  };
  return (
    <form onSubmit={submit} noValidate className="space-y-3">
      <div className="grid gap-3 sm:grid-cols-2">
        <Field label="Link works for" error={fields.expiresAt}>
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
        <Field label="Note for your lab (optional)" hint="Only lab members see it, e.g. who the link is for." error={fields.label}>
          {(p) => <input {...fieldProps(p)} className={inputClass} value={label} maxLength={500} onChange={(e) => setLabel(e.target.value)} />}
        </Field>
      </div>
      {create.isError && !Object.keys(fields).length && <Alert kind="error" title="No link was made">{create.error.message}</Alert>}
      <Button type="submit" disabled={create.isPending}>
        {create.isPending ? "Making the link…" : "Make a read-only link"}
      </Button>
      {made?.link && (
        <Alert kind="success" title="Link ready — copy it now">
          <p className="break-all font-mono text-sm" data-testid="share-url">
            {made.link.url}
          </p>
          <div className="mt-2 flex items-center gap-3">
            <Button variant="secondary" size="sm" className="shrink-0 whitespace-nowrap" onClick={copy}>
              Copy link
            </Button>
            <span className="text-sm text-ink-soft" aria-live="polite">
              {copied ? "Copied." : "Rhomb keeps only a fingerprint of it, so it is shown this once."}
            </span>
          </div>
        </Alert>
      )}
    </form>
  );
}
