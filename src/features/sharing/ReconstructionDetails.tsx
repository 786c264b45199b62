import type { Snapshot, SnapshotReconstruction, SnapshotRun } from "@shared/schemas/shares";
import { Panel } from "../../components/Panel";
import { DensityPlots } from "../../plots/DensityPlots";
import { DensityTable } from "../../plots/DensityTable";
import { DensityFigures } from "../exports/DensityFigures";
import { RunDownloads } from "../exports/SnapshotDownloads";
import { describeCorrections } from "../runs/reconstructionChoice";
import { FitDetails } from "../runs/FitDetails";
import { CheckList } from "../stateView/CheckList";
import { KeyFigures } from "../stateView/KeyFigures";
import { METHOD_NAME } from "../stateView/meritRows";
import { ScoreCard } from "../stateView/ScoreCard";
import { Spectrum } from "../stateView/Spectrum";
import { asReconstructionDto } from "./snapshotAdapters";

export type SnapshotMode = "screen" | "print";

/**
 * One reconstruction of a shared or reported run: method and parameters, key figures, ρ (3D
 * bars on screen; flat bars and the table on paper), scorecard, checks, spectrum, fit details.
 */
export function ReconstructionDetails({ snapshot, run, rec, mode }: { snapshot: Snapshot; run: SnapshotRun; rec: SnapshotReconstruction; mode: SnapshotMode }) {
  const dto = asReconstructionDto(rec, run);
  const target = snapshot.setup.source.targetState;
  const sigma = rec.uncertainties?.rho ?? null;
  return (
    <div className="space-y-4">
      <p className="text-sm text-ink-soft" data-testid="method-line">
        <strong className="text-ink">{METHOD_NAME[rec.method]}</strong> of counts revision {rec.revisionNumber}; {describeCorrections(rec.corrections)};{" "}
        {rec.uncertainties ? `± one standard deviation from ${rec.uncertainties.samples} Monte Carlo samples` : "no Monte Carlo uncertainties"}.
      </p>
      <KeyFigures reconstruction={dto} target={target} />
      {!rec.physical && <p className="text-sm font-bold text-danger">This estimate is not a physical state (a negative eigenvalue); its figures are shown as computed.</p>}
      {mode === "screen" ? (
        <Panel title="Reconstructed state ρ">
          <DensityPlots rho={rec.rho} sigma={sigma} />
        </Panel>
      ) : (
        <>
          <Panel title="Reconstructed state ρ" className="break-inside-avoid">
            <DensityFigures rho={rec.rho} sigma={sigma} name={`${run.name} ${rec.method}`} />
          </Panel>
          <Panel title="ρ element by element" className="break-inside-avoid">
            <DensityTable rho={rec.rho} sigma={sigma} />
          </Panel>
        </>
      )}
      <div className="grid gap-4 lg:grid-cols-3 print:grid-cols-2">
        <Panel title="Scorecard" className="break-inside-avoid">
          <ScoreCard reconstruction={dto} target={target} />
        </Panel>
        <div className="space-y-4">
          <Panel title="Things to check" className="break-inside-avoid">
            <CheckList reconstruction={dto} />
          </Panel>
          <Panel title="Spectrum of ρ" className="break-inside-avoid">
            <Spectrum eigenvalues={rec.eigenvalues} physical={rec.physical} />
          </Panel>
        </div>
        <Panel title="How it was computed" className="break-inside-avoid">
          <FitDetails reconstruction={dto} />
        </Panel>
      </div>
      {mode === "screen" && (
        <>
          <RunDownloads snapshot={snapshot} run={run} reconstruction={rec} />
          <details className="rounded-md border border-paper-sunk bg-paper-raised p-3 print:hidden">
            <summary className="cursor-pointer font-bold text-petrol-700">Save ρ as a figure (PNG or SVG)</summary>
            <div className="mt-3">
              <DensityFigures rho={rec.rho} sigma={sigma} name={`${run.name} ${rec.method}`} />
            </div>
          </details>
        </>
      )}
    </div>
  );
}
