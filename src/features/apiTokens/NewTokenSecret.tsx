import { useState } from "react";
import type { CreatedApiTokenDto } from "@shared/schemas/apiTokens";
import { Alert } from "../../components/Alert";
import { Button } from "../../components/Button";

/** The secret of a token just created: shown this once, with how to use it. */
export function NewTokenSecret({ token, onDone }: { token: CreatedApiTokenDto; onDone: () => void }) {
  const [copied, setCopied] = useState(false);
  const copy = async () => {
    await navigator.clipboard.writeText(token.secret).then(() => setCopied(true), () => setCopied(false));
  };
  const origin = window.location.origin;
  return (
    <div className="space-y-3">
      <Alert kind="caution" title={`Copy the secret of “${token.name}” now`}>
        It is shown only this once: Rhomb keeps just a fingerprint of it (SHA-256) and cannot show it again. Keep it like a password; anyone with it can add runs to{" "}
        <strong>{token.lab.name}</strong> in your name. If it leaks, revoke it below.
      </Alert>
      <div className="flex flex-wrap items-center gap-2">
        <code className="select-all break-all rounded bg-paper-sunk px-3 py-2 font-mono text-sm text-ink" aria-label="Token secret">
          {token.secret}
        </code>
        <Button variant="secondary" size="sm" onClick={copy}>
          {copied ? "Copied ✓" : "Copy"}
        </Button>
      </div>
      <p className="text-sm text-ink-soft">Post each run as it finishes, from a script or with the command line:</p>
      <pre className="overflow-x-auto rounded bg-paper-sunk p-2 text-xs">{`# one file (or many, or a zip) as a batch, then wait for the result
RHOMB_URL=${origin} RHOMB_TOKEN=${token.secret} \\
  npm run --silent rhomb -- upload --session <session id> run-0042.csv

# one run as JSON, the reconstruction comes back in the answer
curl -H "Authorization: Bearer ${token.secret}" -H "Content-Type: application/json" \\
  --data @run-0042.json ${origin}/api/labs/${token.lab.id}/sessions/<session id>/acquisitions`}</pre>
      <Button variant="quiet" onClick={onDone}>
        I have copied it — hide the secret
      </Button>
    </div>
  );
}
