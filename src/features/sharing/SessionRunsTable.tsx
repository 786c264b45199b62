import { FIDELITY_KEY } from "@shared/schemas/reconstructions";
import type { Snapshot, SnapshotRun } from "@shared/schemas/shares";
import { formatCount } from "@shared/format/uncertainty";
import { DataTable } from "../../components/DataTable";
import { ValueWithError } from "../../components/ValueWithError";
import { BELL_SYMBOL } from "../stateView/meritRows";
import { defaultOf } from "./snapshotAdapters";

/** Every run of a shared session with its headline figures; `onShow` opens one below. */
export function SessionRunsTable({ snapshot, shownId, onShow }: { snapshot: Snapshot; shownId?: string; onShow?: (runId: string) => void }) {
  const target = snapshot.setup.source.targetState;
  const key = FIDELITY_KEY[target];
  const figure = (run: SnapshotRun, k: typeof key | "concurrence" | "purity") => {
    const r = defaultOf(run);
    return r ? <ValueWithError value={r.metrics[k]} uncertainty={r.uncertainties?.metrics[k]} /> : "—";
  };
  return (
    <DataTable<SnapshotRun>
      caption={`${snapshot.runs.length} run${snapshot.runs.length === 1 ? "" : "s"} of this session (figures of the maximum-likelihood reconstruction, ± one standard deviation)`}
      rows={snapshot.runs}
      rowKey={(r) => r.id}
      empty={<p className="text-sm text-ink-soft">This session has no runs yet.</p>}
      columns={[
        {
          key: "name",
          header: "Run",
          render: (r) =>
            onShow ? (
              <button type="button" className="rounded px-1 text-left font-bold text-petrol-700 underline aria-pressed:bg-petrol-700 aria-pressed:text-paper-raised aria-pressed:no-underline" aria-pressed={r.id === shownId} onClick={() => onShow(r.id)}>
                {r.name}
                {r.id === shownId && <span className="sr-only"> (shown below)</span>}
              </button>
            ) : (
              r.name
            ),
        },
        { key: "counts", header: "Coincidences", numeric: true, render: (r) => formatCount(r.totalCounts) },
        { key: "fidelity", header: `Fidelity to ${BELL_SYMBOL[target]}`, numeric: true, render: (r) => figure(r, key) },
        { key: "concurrence", header: "Concurrence", numeric: true, render: (r) => figure(r, "concurrence") },
        { key: "purity", header: "Purity", numeric: true, render: (r) => figure(r, "purity") },
      ]}
    />
  );
}
