import { useState } from "react";
import { useNavigate } from "react-router-dom";
import type { MemberDto } from "@shared/schemas/members";
import type { LabRole } from "@shared/schemas/roles";
import { useChangeRole, useMembers, useRemoveMember } from "../../api/members";
import { Alert } from "../../components/Alert";
import { Button } from "../../components/Button";
import { DataTable } from "../../components/DataTable";
import { Dialog } from "../../components/Dialog";
import { QueryState } from "../../components/QueryState";
import { ROLE_ORDER, roleWords } from "./roleWords";
import { formatDate } from "@shared/format/dates";

/** The lab's people: owners change roles and remove people; everyone else may leave. */
export function MembersTable({ labId }: { labId: string }) {
  const members = useMembers(labId);
  const changeRole = useChangeRole(labId);
  const remove = useRemoveMember(labId);
  const navigate = useNavigate();
  const [leaving, setLeaving] = useState<MemberDto | null>(null);
  const error = changeRole.error ?? remove.error;

  const onRole = (m: MemberDto, role: LabRole) => changeRole.mutate({ userId: m.userId, role }, { onSettled: () => void members.refetch() });
  const confirmRemove = () => {
    if (!leaving) return;
    remove.mutate(leaving.userId, {
      onSuccess: () => {
        if (leaving.isYou) navigate("/", { replace: true });
        setLeaving(null);
      },
      onError: () => setLeaving(null),
    });
  };

  return (
    <QueryState query={members} what="the members">
      {({ data, can }) => {
        // The only owner cannot leave (the server refuses too): hand the lab over first.
        const soleOwner = data.filter((m) => m.role === "owner").length === 1;
        return (
        <>
          {error && (
            <div className="mb-3">
              <Alert kind="error" title="That change was not made">
                {error.message}
              </Alert>
            </div>
          )}
          <DataTable
            caption="Members"
            captionHidden
            rows={data}
            rowKey={(m) => m.userId}
            columns={[
              { key: "name", header: "Name", render: (m) => <span className="font-bold">{m.displayName}{m.isYou && <span className="ml-1 font-normal text-ink-faint">(you)</span>}</span> },
              { key: "email", header: "E-mail", render: (m) => m.email },
              {
                key: "role",
                header: "Role",
                render: (m) =>
                  can.manage ? (
                    <select
                      aria-label={`Role of ${m.displayName}`}
                      value={m.role}
                      disabled={changeRole.isPending}
                      onChange={(e) => onRole(m, e.target.value as LabRole)}
                      className="rounded-md border border-ink-faint bg-paper-raised px-2 py-1 text-sm"
                    >
                      {ROLE_ORDER.map((r) => (
                        <option key={r} value={r}>
                          {roleWords[r].label}
                        </option>
                      ))}
                    </select>
                  ) : (
                    roleWords[m.role].label
                  ),
              },
              { key: "joined", header: "Joined", render: (m) => formatDate(m.joinedAt) },
              {
                key: "actions",
                header: <span className="sr-only">Actions</span>,
                render: (m) =>
                  (can.manage || m.isYou) && !(soleOwner && m.role === "owner") && (
                    <Button variant="quiet" size="sm" onClick={() => setLeaving(m)} aria-label={m.isYou ? "Leave this lab" : `Remove ${m.displayName}`}>
                      {m.isYou ? "Leave" : "Remove"}
                    </Button>
                  ),
              },
            ]}
          />
          <Dialog
            open={!!leaving}
            title={leaving?.isYou ? "Leave this lab?" : `Remove ${leaving?.displayName ?? ""}?`}
            onClose={() => setLeaving(null)}
            actions={
              <>
                <Button variant="secondary" onClick={() => setLeaving(null)}>
                  Cancel
                </Button>
                <Button variant="danger" onClick={confirmRemove} disabled={remove.isPending}>
                  {leaving?.isYou ? "Leave the lab" : "Remove"}
                </Button>
              </>
            }
          >
            {leaving?.isYou
              ? "You will no longer see anything in this lab. An owner can invite you again."
              : `${leaving?.displayName ?? ""} will no longer see anything in this lab. What they added stays.`}
          </Dialog>
        </>
        );
      }}
    </QueryState>
  );
}
