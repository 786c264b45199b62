import { useId, useState } from "react";
import type { Snapshot, SnapshotRun } from "@shared/schemas/shares";
import { formatDecimal } from "@shared/format/uncertainty";
import { inputClass } from "../../components/Field";
import { EmptyState } from "../../components/QueryState";
import { Panel } from "../../components/Panel";
import { RunDownloads } from "../exports/SnapshotDownloads";
import { describeCorrections } from "../runs/reconstructionChoice";
import { METHOD_NAME } from "../stateView/meritRows";
import { ReconstructionDetails, type SnapshotMode } from "./ReconstructionDetails";
import { SnapshotCounts } from "./SnapshotCounts";
import { defaultOf } from "./snapshotAdapters";
import { formatDate } from "@shared/format/dates";

const KIND_WORDS = { tomography: "Tomography", bell: "Bell test", fringe: "Fringe scan" } as const;

function conditionsText(run: SnapshotRun): string {
  const c = run.conditions;
  return [
    c.pumpPowerMw !== null && `pump ${formatDecimal(c.pumpPowerMw, 3)} mW`,
    c.crystalTemperatureC !== null && `crystal ${formatDecimal(c.crystalTemperatureC, 3)} °C`,
    c.compensatorTiltDeg !== null && `compensator tilt ${formatDecimal(c.compensatorTiltDeg, 2)}°`,
  ]
    .filter(Boolean)
    .join(", ");
}

/**
 * One run of a snapshot. On screen the reader picks a reconstruction; on paper `allReconstructions`
 * prints every one of them (a run report), else only the one shown first (a session report).
 */
export function SnapshotRunSection({ snapshot, run, mode, allReconstructions = false }: { snapshot: Snapshot; run: SnapshotRun; mode: SnapshotMode; allReconstructions?: boolean }) {
  const first = snapshot.focusReconstructionId ?? defaultOf(run)?.id ?? null;
  const [selectedId, setSelectedId] = useState(first);
  const pickerId = useId();
  const selected = run.reconstructions.find((r) => r.id === selectedId) ?? defaultOf(run);
  const shown = mode === "print" && allReconstructions ? run.reconstructions : selected ? [selected] : [];
  const conditions = conditionsText(run);
  return (
    <section className="space-y-4" aria-labelledby={`${pickerId}-title`}>
      <div className="keep-with-next">
        {/* A run or state shared on its own already carries the run's name as the page title. */}
        <h2 id={`${pickerId}-title`} className={snapshot.itemType === "session" ? "text-xl font-bold text-ink" : "sr-only"}>
          {run.name}
        </h2>
        <p className="text-sm text-ink-soft">
          {KIND_WORDS[run.kind]}, setting set {run.settingSetId}, recorded {formatDate(run.createdAt)}
          {conditions && ` · ${conditions}`}
        </p>
        {run.notes && <p className="mt-1 whitespace-pre-wrap text-sm text-ink-soft">{run.notes}</p>}
      </div>
      {mode === "screen" && run.reconstructions.length > 1 && (
        <div className="flex flex-wrap items-center gap-2 print:hidden">
          <label htmlFor={pickerId} className="text-sm font-bold text-ink">
            Reconstruction
          </label>
          <select id={pickerId} className={`${inputClass} max-w-md`} value={selected?.id} onChange={(e) => setSelectedId(e.target.value)}>
            {run.reconstructions.map((r) => (
              <option key={r.id} value={r.id}>
                {METHOD_NAME[r.method]} — {describeCorrections(r.corrections)}
              </option>
            ))}
          </select>
        </div>
      )}
      {shown.length === 0 && (
        <EmptyState title="No reconstruction of these counts">
          {run.kind === "tomography" ? "The lab has not reconstructed a state from this run." : "This run is analysed as a Bell test or fringe scan, not as a tomography."}
        </EmptyState>
      )}
      {shown.map((rec, i) => (
        <div key={rec.id} className={shown.length > 1 && i > 0 ? "break-before-page" : ""}>
          {shown.length > 1 && (
            <h3 className="mb-2 text-lg font-bold text-ink">
              {i + 1}. {METHOD_NAME[rec.method]} — {describeCorrections(rec.corrections)}
            </h3>
          )}
          <ReconstructionDetails snapshot={snapshot} run={run} rec={rec} mode={mode} />
        </div>
      ))}
      {shown.length === 0 && mode === "screen" && <RunDownloads snapshot={snapshot} run={run} />}
      <Panel title="Raw counts" className="break-inside-avoid">
        <SnapshotCounts run={run} />
      </Panel>
    </section>
  );
}
