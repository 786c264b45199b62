import { Link, useSearchParams } from "react-router-dom";
import type { CompareDto } from "@shared/schemas/compare";
import type { ReconstructionMethod } from "@shared/schemas/reconstructions";
import { LIMITS } from "@shared/limits";
import { useCompare } from "../../api/reconstructions";
import { useLabHome } from "../../api/labSessions";
import { PageTitle } from "../../components/PageTitle";
import { Panel } from "../../components/Panel";
import { EmptyState, QueryState } from "../../components/QueryState";
import { SegmentedToggle } from "../../components/SegmentedToggle";
import { DensityBars2D } from "../../plots/DensityBars2D";
import { sharedScale } from "../../plots/densityModel";
import { labPaths } from "../notebook/labPaths";
import { RunSearch } from "../notebook/RunSearch";
import { METHOD_NAME } from "../stateView/meritRows";
import { CompareFigures } from "./CompareFigures";

/** Two or more runs side by side: their states on one scale, their figures and the differences. */
export function CompareView({ labId }: { labId: string }) {
  const [params, setParams] = useSearchParams();
  const ids = (params.get("runs") ?? "").split(",").filter(Boolean).slice(0, LIMITS.compareRuns);
  const method = (params.get("method") as ReconstructionMethod | null) ?? "mle";
  const compare = useCompare(labId, ids, method);
  const home = useLabHome(labId);
  const setMethod = (m: ReconstructionMethod) => setParams((p) => (p.set("method", m), p));
  return (
    <>
      <PageTitle subtitle={`Up to ${LIMITS.compareRuns} runs side by side; differences are to the first.`}>Compare runs</PageTitle>
      {ids.length >= 2 ? (
        <>
          <div className="mb-4">
            <SegmentedToggle label="Method" value={method} onChange={setMethod} options={(Object.keys(METHOD_NAME) as ReconstructionMethod[]).map((m) => ({ value: m, label: METHOD_NAME[m] }))} />
          </div>
          <QueryState query={compare} what="the comparison">
            {(c) => <Comparison labId={labId} compare={c} />}
          </QueryState>
        </>
      ) : (
        <div className="mb-4">
          <EmptyState title={ids.length === 1 ? "Tick at least one more run" : "Choose the runs to compare"}>Tick two or more runs in the list below, then press “Compare ticked”.</EmptyState>
        </div>
      )}
      <div className="mt-4">
        <Panel title="Choose runs">
          <RunSearch labId={labId} sources={home.data?.bestBySource.map((b) => b.source) ?? []} initialSelection={ids} />
        </Panel>
      </div>
    </>
  );
}

function Comparison({ labId, compare }: { labId: string; compare: CompareDto }) {
  const scale = Math.max(...compare.items.map((i) => sharedScale(i.reconstruction.rho)));
  return (
    <div className="space-y-4">
      <Panel title="States on one scale">
        <div className="flex gap-4 overflow-x-auto pb-2">
          {compare.items.map(({ run, reconstruction }) => (
            <div key={run.id} className="w-72 shrink-0">
              <p className="mb-1 text-sm">
                <Link className="font-bold text-petrol-700 underline" to={labPaths.run(labId, run.id)}>
                  {run.name}
                </Link>{" "}
                <span className="text-ink-faint">{run.session.title}</span>
              </p>
              <DensityBars2D rho={reconstruction.rho} sigma={reconstruction.uncertainties?.rho} scale={scale} stacked />
            </div>
          ))}
        </div>
      </Panel>
      <Panel title="Figures and differences">
        <CompareFigures compare={compare} />
      </Panel>
      {compare.differences.length > 0 && (
        <Panel title="Where the states differ (this run − first run)">
          <div className="flex gap-4 overflow-x-auto pb-2">
            {compare.differences.map((d) => {
              const run = compare.items.find((i) => i.run.id === d.runId)!.run;
              return (
                <div key={d.runId} className="w-72 shrink-0">
                  <p className="mb-1 text-sm font-bold">{run.name} − {compare.items[0].run.name}</p>
                  <DensityBars2D rho={d.rho} scale={sharedScale(d.rho)} stacked />
                </div>
              );
            })}
          </div>
        </Panel>
      )}
    </div>
  );
}
