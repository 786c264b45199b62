import { useInvitations, useRevokeInvitation } from "../../api/invitations";
import { Alert } from "../../components/Alert";
import { Button } from "../../components/Button";
import { DataTable } from "../../components/DataTable";
import { EmptyState, QueryState } from "../../components/QueryState";
import { StatusBadge } from "../../components/StatusBadge";
import { roleWords } from "./roleWords";
import { formatDateTime } from "@shared/format/dates";

/** Invitations not yet accepted: who, which role, until when; owners withdraw them here. */
export function InvitationsList({ labId }: { labId: string }) {
  const invitations = useInvitations(labId, true);
  const revoke = useRevokeInvitation(labId);
  return (
    <QueryState query={invitations} what="the invitations">
      {(rows) => (
        <>
          {revoke.error && (
            <div className="mb-3">
              <Alert kind="error" title="Could not withdraw">
                {revoke.error.message}
              </Alert>
            </div>
          )}
          <DataTable
            caption="Open invitations"
            captionHidden
            rows={rows}
            rowKey={(i) => i.id}
            empty={<EmptyState title="No open invitations">Invite someone above; their invitation waits here until they accept it.</EmptyState>}
            columns={[
              { key: "email", header: "E-mail", render: (i) => i.email },
              { key: "role", header: "Role", render: (i) => roleWords[i.role].label },
              { key: "status", header: "Status", render: (i) => (i.status === "pending" ? <StatusBadge tone="pending">Waiting</StatusBadge> : <StatusBadge tone="down">Expired</StatusBadge>) },
              { key: "expires", header: "Link valid until", render: (i) => formatDateTime(i.expiresAt) },
              { key: "by", header: "Invited by", render: (i) => i.invitedBy },
              {
                key: "actions",
                header: <span className="sr-only">Actions</span>,
                render: (i) => (
                  <Button variant="quiet" size="sm" disabled={revoke.isPending} onClick={() => revoke.mutate(i.id)} aria-label={`Withdraw the invitation to ${i.email}`}>
                    Withdraw
                  </Button>
                ),
              },
            ]}
          />
        </>
      )}
    </QueryState>
  );
}
