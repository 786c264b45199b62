import { useDevOutbox } from "../../api/devOutbox";
import { ApiError } from "../../api/client";
import { Alert } from "../../components/Alert";
import { EmptyState, QueryState } from "../../components/QueryState";
import { formatDateTime } from "@shared/format/dates";

const LINK_WORDS: Record<string, string> = {
  "/verify-email": "Confirm the address",
  "/reset-password": "Choose a new password",
  "/invitation": "Open the invitation",
};

/** Mail the local fake SMTP server caught, newest first, with its links clickable. */
export function DevOutbox() {
  const outbox = useDevOutbox();
  if (outbox.error instanceof ApiError && outbox.error.status === 404) {
    return (
      <Alert kind="info" title="No development outbox here">
        This server sends real e-mail through SMTP_URL, so there is nothing to show.
      </Alert>
    );
  }
  return (
    <QueryState query={outbox} what="the outbox">
      {(mails) =>
        mails.length === 0 ? (
          <EmptyState title="No mail yet">Sign up, ask for a password reset or invite someone: the e-mail appears here within a second.</EmptyState>
        ) : (
          <ol className="space-y-3" aria-label="Caught e-mails, newest first">
            {mails.map((m) => (
              <li key={m.id} className="rounded-lg border border-paper-sunk bg-paper-raised p-4 shadow-sm">
                <div className="flex flex-wrap items-baseline justify-between gap-2">
                  <h2 className="font-bold text-ink">{m.subject}</h2>
                  <time className="text-sm text-ink-faint" dateTime={m.receivedAt}>
                    {formatDateTime(m.receivedAt)}
                  </time>
                </div>
                <p className="text-sm text-ink-soft">
                  To {m.to.join(", ")} · from {m.from}
                </p>
                {m.links.length > 0 && (
                  <ul className="mt-2 space-y-1">
                    {m.links.map((l) => (
                      <li key={l}>
                        <a className="font-bold text-petrol-700 underline" href={l}>
                          {LINK_WORDS[new URL(l).pathname] ?? "Open the link"}
                        </a>
                        <span className="ml-2 break-all text-xs text-ink-faint">{l}</span>
                      </li>
                    ))}
                  </ul>
                )}
                <details className="mt-2">
                  <summary className="cursor-pointer text-sm text-ink-soft">Full text</summary>
                  <pre className="mt-2 whitespace-pre-wrap rounded bg-paper p-3 text-sm text-ink">{m.text}</pre>
                </details>
              </li>
            ))}
          </ol>
        )
      }
    </QueryState>
  );
}
