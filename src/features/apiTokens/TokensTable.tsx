import { useState } from "react";
import type { ApiTokenDto } from "@shared/schemas/apiTokens";
import { useRevokeApiToken } from "../../api/apiTokens";
import { Alert } from "../../components/Alert";
import { Button } from "../../components/Button";
import { DataTable } from "../../components/DataTable";
import { Dialog } from "../../components/Dialog";
import { EmptyState } from "../../components/QueryState";
import { formatDateTime } from "@shared/format/dates";

const STATUS = {
  active: { label: "Active", glyph: "●", cls: "bg-success-soft text-success" },
  expired: { label: "Expired", glyph: "○", cls: "bg-paper-sunk text-ink-soft" },
  revoked: { label: "Revoked", glyph: "■", cls: "bg-danger-soft text-danger" },
} as const;

const when = (iso: string | null, none: string) => (iso ? formatDateTime(iso) : none);

export function TokensTable({ tokens }: { tokens: ApiTokenDto[] }) {
  const [confirm, setConfirm] = useState<ApiTokenDto | null>(null);
  const revoke = useRevokeApiToken();
  return (
    <>
      {revoke.isError && <Alert kind="error" title="The token was not revoked">{revoke.error.message}</Alert>}
      <DataTable<ApiTokenDto>
        caption="Your API tokens"
        captionHidden
        rows={tokens}
        rowKey={(t) => t.id}
        empty={<EmptyState title="No tokens yet">Create one above for each computer or script that should add runs.</EmptyState>}
        columns={[
          { key: "name", header: "Name", render: (t) => <span className="font-bold text-ink">{t.name}</span> },
          { key: "lab", header: "Lab", render: (t) => t.lab.name },
          { key: "hint", header: "Starts with", render: (t) => <code className="text-xs">{t.hint}</code> },
          { key: "created", header: "Created", render: (t) => when(t.createdAt, "—") },
          { key: "used", header: "Last used", render: (t) => when(t.lastUsedAt, "never") },
          { key: "expires", header: "Expires", render: (t) => when(t.expiresAt, "never") },
          {
            key: "status",
            header: "Status",
            render: (t) => (
              <span className={`inline-flex items-center gap-1.5 whitespace-nowrap rounded-full px-2.5 py-0.5 text-sm font-bold ${STATUS[t.status].cls}`}>
                <span aria-hidden="true">{STATUS[t.status].glyph}</span>
                {STATUS[t.status].label}
              </span>
            ),
          },
          {
            key: "actions",
            header: <span className="sr-only">Actions</span>,
            render: (t) =>
              t.status === "active" && (
                <Button variant="quiet" size="sm" onClick={() => setConfirm(t)} aria-label={`Revoke ${t.name}`}>
                  Revoke
                </Button>
              ),
          },
        ]}
      />
      <Dialog
        open={!!confirm}
        title={`Revoke “${confirm?.name ?? ""}”?`}
        onClose={() => setConfirm(null)}
        actions={
          <>
            <Button variant="secondary" onClick={() => setConfirm(null)}>
              Keep it
            </Button>
            <Button
              variant="danger"
              onClick={async () => {
                if (confirm) await revoke.mutateAsync(confirm.id).catch(() => null);
                setConfirm(null);
              }}
            >
              Revoke now
            </Button>
          </>
        }
      >
        It stops working at once: scripts using it get “401: this API token was revoked”. Runs it added stay. This cannot be undone — create a new token instead.
      </Dialog>
    </>
  );
}
