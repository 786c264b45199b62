import type { ArmAnglesSchema, RunDetailDto } from "@shared/schemas/runs";
import type { z } from "zod";
import { formatDecimal } from "@shared/format/uncertainty";
import { DataTable } from "../../components/DataTable";
import { formatDateTime } from "@shared/format/dates";

type Row = RunDetailDto["rows"][number] & { index: number };

export const settingText = (s: string | z.infer<typeof ArmAnglesSchema>[]) =>
  typeof s === "string" ? s : s.map((a, i) => `${i === 0 ? "A" : "B"}: Q ${formatDecimal(a.qwpDeg, 2)}°, H ${formatDecimal(a.hwpDeg, 2)}°${a.port === "reflected" ? " refl." : ""}`).join(" · ");

/** The counts exactly as entered (current revision), their history and the uploaded file. */
export function RawCounts({ run }: { run: RunDetailDto }) {
  const hasSingles = run.rows.some((r) => r.singlesA !== null || r.singlesB !== null);
  const hasMonitor = run.rows.some((r) => r.monitor !== null);
  const intText = (x: number | null) => (x === null ? "—" : String(x));
  return (
    <div className="max-w-3xl space-y-3">
      <DataTable<Row>
        caption={`Counts as entered, revision ${run.revisionNumber}`}
        rows={run.rows.map((r, index) => ({ ...r, index }))}
        rowKey={(r) => String(r.index)}
        columns={[
          { key: "n", header: "#", numeric: true, render: (r) => r.index + 1 },
          { key: "setting", header: "Setting", render: (r) => settingText(r.setting) },
          { key: "counts", header: "Coincidences", numeric: true, render: (r) => r.counts },
          { key: "seconds", header: "Exposure (s)", numeric: true, render: (r) => formatDecimal(r.seconds, 6) },
          ...(hasSingles
            ? [
                { key: "sa", header: "Singles A", numeric: true, render: (r: Row) => intText(r.singlesA) },
                { key: "sb", header: "Singles B", numeric: true, render: (r: Row) => intText(r.singlesB) },
              ]
            : []),
          ...(hasMonitor ? [{ key: "m", header: "Monitor", numeric: true, render: (r: Row) => (r.monitor === null ? "—" : String(r.monitor)) }] : []),
        ]}
      />
      {run.revisions.length > 1 && (
        <details className="text-sm">
          <summary className="cursor-pointer font-bold text-petrol-700">{run.revisions.length} revisions of the counts</summary>
          <ol className="mt-1 space-y-1 pl-5">
            {run.revisions.map((rev) => (
              <li key={rev.id} className="list-decimal">
                Revision {rev.number}, {formatDateTime(rev.createdAt)} by {rev.createdBy?.displayName ?? "someone no longer in the lab"}: {rev.reason}
                {rev.changes.length > 0 && <span className="text-ink-faint"> ({rev.changes.length} change{rev.changes.length === 1 ? "" : "s"})</span>}
              </li>
            ))}
          </ol>
        </details>
      )}
      {run.attachments.length > 0 && (
        <ul className="text-sm">
          {run.attachments.map((a) => (
            <li key={a.id}>
              Uploaded file:{" "}
              <a className="font-bold text-petrol-700 underline" href={`/api${a.downloadPath}`} download={a.fileName}>
                {a.fileName}
              </a>{" "}
              <span className="text-ink-faint">({a.sizeBytes} bytes, kept as it came)</span>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
