import { Link } from "react-router-dom";
import type { BatchSummaryDto } from "@shared/schemas/batches";
import { useBatches } from "../../api/batches";
import { DataTable } from "../../components/DataTable";
import { Panel } from "../../components/Panel";
import { EmptyState, QueryState } from "../../components/QueryState";
import { STATUS_LOOK } from "./BatchStatusBadge";
import { formatDateTime } from "@shared/format/dates";

/** The lab's latest batches with their counts; each opens its progress page. */
export function RecentBatches({ labId }: { labId: string }) {
  const batches = useBatches(labId);
  return (
    <Panel title="Recent batches">
      <QueryState query={batches} what="batches">
        {(rows) => (
          <DataTable<BatchSummaryDto>
            caption="Recent batches of this lab"
            captionHidden
            rows={rows}
            rowKey={(b) => b.id}
            empty={<EmptyState title="No batches yet">Batches you and your lab upload are listed here, with what became of each file.</EmptyState>}
            columns={[
              {
                key: "when",
                header: "Uploaded",
                render: (b) => (
                  <Link className="font-bold text-petrol-700 underline" to={`/labs/${labId}/batches/${b.id}`}>
                    {formatDateTime(b.createdAt)}
                  </Link>
                ),
              },
              { key: "session", header: "Session", render: (b) => b.session.title },
              { key: "by", header: "By", render: (b) => `${b.createdBy?.displayName ?? "—"}${b.origin === "token" ? " (API token)" : ""}` },
              { key: "files", header: "Files", numeric: true, render: (b) => b.fileCount },
              {
                key: "outcome",
                header: "Outcome",
                render: (b) => (
                  // relative: the screen-reader labels are positioned inside the cell, not the page
                  <span className="relative whitespace-nowrap text-ink-soft">
                    {b.done ? "" : "running · "}
                    {(["stored", "duplicate", "failed"] as const).map((s) => (
                      <span key={s} className="mr-3" title={STATUS_LOOK[s].label}>
                        <span aria-hidden="true">{STATUS_LOOK[s].glyph}</span> <span className="sr-only">{STATUS_LOOK[s].label}</span>
                        <span className="num">{b.counts[s]}</span>
                      </span>
                    ))}
                  </span>
                ),
              },
            ]}
          />
        )}
      </QueryState>
      <p className="mt-2 text-xs text-ink-faint">
        {(["stored", "duplicate", "failed"] as const).map((s) => `${STATUS_LOOK[s].glyph} ${STATUS_LOOK[s].label.toLowerCase()}`).join(" · ")}
      </p>
    </Panel>
  );
}
