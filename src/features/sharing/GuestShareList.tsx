import { Link } from "react-router-dom";
import type { GuestShareDto } from "@shared/schemas/shares";
import { useGuestShares } from "../../api/shares";
import { DataTable } from "../../components/DataTable";
import { EmptyState, QueryState } from "../../components/QueryState";
import { StatusBadge } from "../../components/StatusBadge";
import { ITEM_LABEL, STATUS_WORDS } from "./shareWords";
import { formatDate } from "@shared/format/dates";

/** The signed-in guest's shared items, newest first; closed ones say why they no longer open. */
export function GuestShareList() {
  const shares = useGuestShares();
  return (
    <QueryState query={shares} what="what was shared with you">
      {(list) => (
        <DataTable<GuestShareDto>
          caption="Shared with you"
          captionHidden
          rows={list}
          rowKey={(s) => s.id}
          empty={<EmptyState title="Nothing is shared with you yet">When a lab shares a session, run or state with your e-mail address, it appears here and you get an e-mail.</EmptyState>}
          columns={[
            {
              key: "item",
              header: "Item",
              render: (s) =>
                s.status === "active" ? (
                  <Link className="font-bold text-petrol-700 underline" to={`/guest/${s.id}`}>
                    {s.itemTitle}
                  </Link>
                ) : (
                  <span className="text-ink-soft">{s.itemTitle}</span>
                ),
            },
            { key: "type", header: "What", render: (s) => ITEM_LABEL[s.itemType] },
            { key: "lab", header: "Lab", render: (s) => (s.lab.institution ? `${s.lab.name}, ${s.lab.institution}` : s.lab.name) },
            { key: "by", header: "Shared by", render: (s) => s.sharedBy },
            { key: "when", header: "Shared on", render: (s) => formatDate(s.createdAt) },
            { key: "status", header: "Status", render: (s) => <StatusBadge tone={STATUS_WORDS[s.status].tone}>{STATUS_WORDS[s.status].label(s.expiresAt)}</StatusBadge> },
          ]}
        />
      )}
    </QueryState>
  );
}
