import type { SnapshotRun } from "@shared/schemas/shares";
import { formatCount, formatDecimal } from "@shared/format/uncertainty";
import { DataTable } from "../../components/DataTable";
import { formatDate } from "@shared/format/dates";

type Row = SnapshotRun["rows"][number] & { index: number };

const settingText = (s: Row["setting"]) =>
  typeof s === "string" ? s : s.map((a, i) => `${"ABCD"[i]}: QWP ${formatDecimal(a.qwpDeg, 2)}°, HWP ${formatDecimal(a.hwpDeg, 2)}°${a.port === "reflected" ? ", reflected port" : ""}`).join(" · ");

const orDash = (x: number | null) => (x === null ? "—" : formatCount(x));

/** The raw counts exactly as recorded, and the corrections they went through. */
export function SnapshotCounts({ run }: { run: SnapshotRun }) {
  const singles = run.rows.some((r) => r.singlesA !== null || r.singlesB !== null);
  const monitor = run.rows.some((r) => r.monitor !== null);
  return (
    <div className="space-y-2">
      <DataTable<Row>
        caption={`Raw counts, revision ${run.revisionNumber} (${run.rows.length} settings, ${formatCount(run.totalCounts)} coincidences)`}
        rows={run.rows.map((r, index) => ({ ...r, index }))}
        rowKey={(r) => String(r.index)}
        columns={[
          { key: "n", header: "#", numeric: true, render: (r) => r.index + 1 },
          { key: "setting", header: "Setting (photon A first)", render: (r) => settingText(r.setting) },
          { key: "counts", header: "Coincidences", numeric: true, render: (r) => formatCount(r.counts) },
          { key: "seconds", header: "Exposure (s)", numeric: true, render: (r) => formatDecimal(r.seconds, 6) },
          ...(singles ? [{ key: "sa", header: "Singles A", numeric: true, render: (r: Row) => orDash(r.singlesA) }, { key: "sb", header: "Singles B", numeric: true, render: (r: Row) => orDash(r.singlesB) }] : []),
          ...(monitor ? [{ key: "m", header: "Monitor", numeric: true, render: (r: Row) => (r.monitor === null ? "—" : String(r.monitor)) }] : []),
        ]}
      />
      {run.countRevisions.length > 0 && (
        <div className="text-sm text-ink-soft">
          <p className="font-bold text-ink">Corrections of these counts</p>
          <ul className="list-disc pl-5">
            {run.countRevisions.map((r) => (
              <li key={r.number}>
                Revision {r.number} ({formatDate(r.createdAt)}): {r.reason}
              </li>
            ))}
          </ul>
        </div>
      )}
    </div>
  );
}
