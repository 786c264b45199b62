import { Link } from "react-router-dom";
import type { RunDto } from "@shared/schemas/runs";
import type { BellTarget } from "@shared/schemas/sources";
import { formatDecimal } from "@shared/format/uncertainty";
import { DataTable, type Column, type SortState } from "../../components/DataTable";
import { ValueWithError } from "../../components/ValueWithError";
import { labPaths } from "../notebook/labPaths";
import { BELL_SYMBOL } from "../stateView/meritRows";
import { formatDateTime } from "@shared/format/dates";

const KIND: Record<RunDto["kind"], string> = { tomography: "Tomography", bell: "Bell test", fringe: "Fringe scan" };

/** Runs with their key figures (newest maximum-likelihood result); optional selection for comparing. */
export function RunsTable({ labId, runs, caption, sort, onSort, showSession = false, selected, onToggle, empty }: {
  labId: string;
  runs: RunDto[];
  caption: string;
  sort?: SortState;
  onSort?: (s: SortState) => void;
  showSession?: boolean;
  selected?: Set<string>;
  onToggle?: (id: string) => void;
  empty?: React.ReactNode;
}) {
  const columns: Column<RunDto>[] = [
    ...(selected && onToggle
      ? [{ key: "pick", header: <span className="sr-only">Compare</span>, render: (r: RunDto) => <input type="checkbox" aria-label={`Compare ${r.name}`} checked={selected.has(r.id)} onChange={() => onToggle(r.id)} /> }]
      : []),
    { key: "name", header: "Run", sortKey: "name", render: (r) => <Link className="font-bold text-petrol-700 underline" to={labPaths.run(labId, r.id)}>{r.name}</Link> },
    ...(showSession ? [{ key: "session", header: "Session", render: (r: RunDto) => <Link className="text-petrol-700 underline" to={labPaths.session(labId, r.session.id)}>{r.session.title}</Link> }] : []),
    { key: "kind", header: "Measurement", sortKey: "kind", render: (r) => (r.kind === "tomography" ? `Tomography, ${r.rowCount} settings` : KIND[r.kind]) },
    { key: "pump", header: "Pump (mW)", numeric: true, sortKey: "pumpPowerMw", render: (r) => formatDecimal(r.conditions.pumpPowerMw, 3) },
    {
      key: "fidelity",
      header: "Fidelity",
      numeric: true,
      sortKey: "fidelity",
      render: (r) =>
        r.headline ? (
          <span title={`to ${BELL_SYMBOL[r.source.targetState as BellTarget] ?? r.source.targetState}${r.headline.accidentalsSubtracted ? ", accidentals subtracted" : ""}`}>
            <ValueWithError value={r.headline.fidelity} uncertainty={r.headline.fidelityUncertainty} />
          </span>
        ) : (
          "—"
        ),
    },
    { key: "concurrence", header: "Concurrence", numeric: true, sortKey: "concurrence", render: (r) => (r.headline ? <ValueWithError value={r.headline.concurrence} uncertainty={r.headline.concurrenceUncertainty} /> : "—") },
    { key: "purity", header: "Purity", numeric: true, sortKey: "purity", render: (r) => (r.headline ? <ValueWithError value={r.headline.purity} uncertainty={r.headline.purityUncertainty} /> : "—") },
    { key: "chsh", header: "CHSH max", numeric: true, render: (r) => (r.headline ? <ValueWithError value={r.headline.chshMax} uncertainty={r.headline.chshMaxUncertainty} /> : "—") },
    { key: "created", header: "Saved", sortKey: "createdAt", render: (r) => <span className="whitespace-nowrap">{formatDateTime(r.createdAt)}</span> },
  ];
  return <DataTable caption={caption} captionHidden columns={columns} rows={runs} rowKey={(r) => r.id} sort={sort} onSort={onSort} empty={empty} />;
}
