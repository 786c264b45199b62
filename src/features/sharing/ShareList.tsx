import { useState } from "react";
import { Link } from "react-router-dom";
import type { ShareDto, ShareItemType } from "@shared/schemas/shares";
import { useRevokeShare, useShares } from "../../api/shares";
import { Button } from "../../components/Button";
import { Dialog } from "../../components/Dialog";
import { EmptyState, QueryState } from "../../components/QueryState";
import { StatusBadge } from "../../components/StatusBadge";
import { labPaths } from "../notebook/labPaths";
import { ITEM_LABEL, STATUS_WORDS } from "./shareWords";
import { formatDateTime } from "@shared/format/dates";

/** The shared item's name, linked to its page where it has one of its own. */
function ItemName({ labId, share: s }: { labId: string; share: ShareDto }) {
  const to = s.itemType === "session" ? labPaths.session(labId, s.itemId) : s.itemType === "run" ? labPaths.run(labId, s.itemId) : null;
  return (
    <span className="font-normal text-ink-soft">
      {" "}
      · {ITEM_LABEL[s.itemType]}{" "}
      {to ? (
        <Link className="font-bold text-petrol-700 underline" to={to}>
          {s.itemTitle}
        </Link>
      ) : (
        `“${s.itemTitle}”`
      )}
    </span>
  );
}

/** The shares of one item (or of the whole lab): who made each and when, its state, revoke. */
export function ShareList({ labId, item, canRevoke, showItem = false }: { labId: string; item?: { itemType: ShareItemType; itemId: string }; canRevoke: boolean; showItem?: boolean }) {
  const shares = useShares(labId, item);
  const revoke = useRevokeShare(labId);
  const [asking, setAsking] = useState<ShareDto | null>(null);
  return (
    <QueryState query={shares} what="the shares">
      {(list) =>
        list.length === 0 ? (
          <EmptyState title="Not shared yet">Nobody outside the lab can see this. Make a link or share it by e-mail above.</EmptyState>
        ) : (
          <>
            <ul className="divide-y divide-paper-sunk text-sm" aria-label="Shares">
              {list.map((s) => (
                <li key={s.id} className="flex flex-wrap items-start justify-between gap-2 py-2">
                  <div className="min-w-0">
                    <p className="font-bold text-ink">
                      {s.kind === "link" ? "Link" : `Guest: ${s.email}`}
                      {showItem && <ItemName labId={labId} share={s} />}
                      {s.label && <span className="font-normal text-ink-soft"> · {s.label}</span>}
                    </p>
                    <p className="text-ink-soft">
                      Made by {s.createdBy?.displayName ?? "a former member"} on {formatDateTime(s.createdAt)}
                      {s.openCount > 0 ? ` · opened ${s.openCount}×, last ${formatDateTime(s.lastOpenedAt!)}` : " · not opened yet"}
                      {s.revokedAt && ` · revoked by ${s.revokedBy?.displayName ?? "a former member"} on ${formatDateTime(s.revokedAt)}`}
                    </p>
                  </div>
                  <div className="flex items-center gap-2">
                    <StatusBadge tone={STATUS_WORDS[s.status].tone}>{STATUS_WORDS[s.status].label(s.expiresAt)}</StatusBadge>
                    {canRevoke && s.status === "active" && (
                      <Button variant="quiet" size="sm" onClick={() => setAsking(s)}>
                        Revoke
                      </Button>
                    )}
                  </div>
                </li>
              ))}
            </ul>
            <Dialog
              open={!!asking}
              title={asking?.kind === "link" ? "Revoke this link?" : `Stop sharing with ${asking?.email}?`}
              onClose={() => setAsking(null)}
              actions={
                <>
                  <Button variant="secondary" onClick={() => setAsking(null)}>
                    Keep it
                  </Button>
                  <Button variant="danger" disabled={revoke.isPending} onClick={() => asking && revoke.mutate(asking.id, { onSettled: () => setAsking(null) })}>
                    Revoke now
                  </Button>
                </>
              }
            >
              It stops working at once: whoever opens it is told it is no longer valid. The list keeps a record of it.
            </Dialog>
            {revoke.isError && (
              <p role="alert" className="mt-2 text-sm font-bold text-danger">
                {revoke.error.message}
              </p>
            )}
          </>
        )
      }
    </QueryState>
  );
}
