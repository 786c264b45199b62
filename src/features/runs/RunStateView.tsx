import { useState } from "react";
import type { ReconstructionDto, ReconstructionMethod } from "@shared/schemas/reconstructions";
import type { RunDetailDto } from "@shared/schemas/runs";
import type { BellTarget } from "@shared/schemas/sources";
import { EmptyState } from "../../components/QueryState";
import { Panel } from "../../components/Panel";
import { SegmentedToggle } from "../../components/SegmentedToggle";
import { DensityPlots } from "../../plots/DensityPlots";
import { CheckList } from "../stateView/CheckList";
import { METHOD_NAME } from "../stateView/meritRows";
import { ScoreCard } from "../stateView/ScoreCard";
import { Spectrum } from "../stateView/Spectrum";
import { CorrectionsForm } from "./CorrectionsForm";
import { KeyFigures } from "../stateView/KeyFigures";
import { FitDetails } from "./FitDetails";
import { ReconstructionHistory } from "./ReconstructionHistory";
import { ShareExportActions } from "../sharing/ShareExportActions";
import { defaultReconstruction, describeCorrections, ofRevision, reconstructionForMethod } from "./reconstructionChoice";

/** One run's reconstructed state: ρ as bars and numbers, figures of merit, spectrum, warnings. */
export function RunStateView({ labId, run, sessionWindowNs }: { labId: string; run: RunDetailDto; sessionWindowNs: number | null }) {
  const [selectedId, setSelectedId] = useState<string | null>(null);
  // The reconstruction the reader chose (page default, history, or one just made): switching
  // method looks for its corrections, and switching back returns to it, even when the other
  // method had only a raw-count reconstruction to show in between.
  const [chosenId, setChosenId] = useState<string | null>(null);
  const [justMade, setJustMade] = useState<ReconstructionDto | null>(null);
  const all = justMade && !run.reconstructions.some((r) => r.id === justMade.id) ? [justMade, ...run.reconstructions] : run.reconstructions;
  const selected = all.find((r) => r.id === selectedId) ?? defaultReconstruction(all, run.revisionNumber);
  const target = run.source.targetState as BellTarget;

  if (!selected) {
    return (
      <EmptyState title="No reconstruction of these counts yet">
        Choose a method and corrections below to compute one.
      </EmptyState>
    );
  }
  const chosen = all.find((r) => r.id === chosenId) ?? defaultReconstruction(all, run.revisionNumber) ?? selected;
  const choose = (id: string) => {
    setChosenId(id);
    setSelectedId(id);
  };
  const current = ofRevision(all, run.revisionNumber);
  const methods = (Object.keys(METHOD_NAME) as ReconstructionMethod[]).filter((m) => current.some((r) => r.method === m));
  const switchMethod = (m: ReconstructionMethod) => setSelectedId(reconstructionForMethod(all, run.revisionNumber, chosen, m)?.id ?? null);

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-center gap-x-6 gap-y-2">
        <SegmentedToggle label="Method" options={methods.map((m) => ({ value: m, label: METHOD_NAME[m] }))} value={selected.method} onChange={switchMethod} />
        <ShareExportActions labId={labId} itemType="reconstruction" itemId={selected.id} can={run.can} />
        <p className="text-sm text-ink-soft">
          Counts revision {selected.revisionNumber}; {describeCorrections(selected.corrections)}.
          {selected.revisionNumber !== run.revisionNumber && <strong className="ml-1 text-caution">These are older counts than the current revision {run.revisionNumber}.</strong>}
        </p>
      </div>
      <KeyFigures reconstruction={selected} target={target} />
      {!selected.physical && (
        <p className="text-sm font-bold text-danger">This estimate is not a physical state (a negative eigenvalue); its figures are shown as computed, not corrected.</p>
      )}
      <Panel title="Reconstructed state ρ">
        <DensityPlots rho={selected.rho} sigma={selected.uncertainties?.rho} />
      </Panel>
      <div className="grid gap-4 lg:grid-cols-3">
        <Panel title="Scorecard">
          <ScoreCard reconstruction={selected} target={target} />
        </Panel>
        <div className="space-y-4">
          <Panel title="Things to check">
            <CheckList reconstruction={selected} />
          </Panel>
          <Panel title="Spectrum of ρ">
            <Spectrum eigenvalues={selected.eigenvalues} physical={selected.physical} />
          </Panel>
        </div>
        <Panel title="How it was computed">
          <FitDetails reconstruction={selected} />
        </Panel>
      </div>
      <Panel title="Reconstruct again">
        <CorrectionsForm
          key={selected.id}
          labId={labId}
          run={run}
          current={selected}
          sessionWindowNs={sessionWindowNs}
          onCreated={(r) => {
            setJustMade(r);
            choose(r.id);
          }}
        />
      </Panel>
      <Panel title="Every reconstruction of this run">
        <ReconstructionHistory reconstructions={all} selectedId={selected.id} onSelect={choose} target={target} currentRevision={run.revisionNumber} />
      </Panel>
    </div>
  );
}
