import { useState } from "react";
import type { Snapshot } from "@shared/schemas/shares";
import { Panel } from "../../components/Panel";
import { SessionDownloads } from "../exports/SnapshotDownloads";
import type { SnapshotMode } from "./ReconstructionDetails";
import { SessionRunsTable } from "./SessionRunsTable";
import { SnapshotRunSection } from "./SnapshotRunSection";
import { SnapshotSetup } from "./SnapshotSetup";
import { formatDateTime } from "@shared/format/dates";

const ITEM_WORDS = { session: "Lab session", run: "Run", reconstruction: "Reconstructed state" } as const;

/**
 * A shared item or a report: what it is and whose, the setup, then the runs. A session on
 * screen shows one run at a time (picked in the table; 3D views are heavy); on paper, all.
 */
export function SnapshotView({ snapshot, mode, banner }: { snapshot: Snapshot; mode: SnapshotMode; banner?: React.ReactNode }) {
  const [shownId, setShownId] = useState(snapshot.runs[0]?.id);
  const isSession = snapshot.itemType === "session";
  const runs = isSession && mode === "screen" ? snapshot.runs.filter((r) => r.id === shownId) : snapshot.runs;
  const lab = snapshot.lab.institution ? `${snapshot.lab.name}, ${snapshot.lab.institution}` : snapshot.lab.name;
  return (
    <article className="space-y-6">
      <header>
        <p className="text-sm font-bold uppercase tracking-wide text-petrol-700">{ITEM_WORDS[snapshot.itemType]}</p>
        <h1 className="text-2xl font-bold text-ink">{snapshot.title}</h1>
        <p className="mt-1 text-ink-soft">
          {lab} · session “{snapshot.setup.session.title}”, {snapshot.setup.session.date}
        </p>
        {banner}
      </header>
      <Panel title="Source and setup" className="break-inside-avoid">
        <SnapshotSetup setup={snapshot.setup} />
      </Panel>
      {isSession && (
        <Panel title="Runs" className="break-inside-avoid">
          <SessionRunsTable snapshot={snapshot} shownId={mode === "screen" ? shownId : undefined} onShow={mode === "screen" ? setShownId : undefined} />
          {mode === "screen" && (
            <div className="mt-3">
              <SessionDownloads snapshot={snapshot} />
            </div>
          )}
        </Panel>
      )}
      {runs.map((run, i) => (
        <div key={run.id} className={mode === "print" && i > 0 ? "break-before-page" : ""}>
          <SnapshotRunSection snapshot={snapshot} run={run} mode={mode} allReconstructions={!isSession} />
        </div>
      ))}
      <footer className="border-t border-paper-sunk pt-2 text-xs text-ink-faint">
        Made with Rhomb on {formatDateTime(snapshot.generatedAt)}. Raw counts are shown as recorded; every figure carries ± one Monte Carlo standard deviation where computed.
      </footer>
    </article>
  );
}
