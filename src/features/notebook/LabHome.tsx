import { Link } from "react-router-dom";
import type { LabHomeDto } from "@shared/schemas/labHome";
import { useLab } from "../../api/labs";
import { useLabHome } from "../../api/labSessions";
import { ButtonLink } from "../../components/Button";
import { PageTitle } from "../../components/PageTitle";
import { Panel } from "../../components/Panel";
import { EmptyState, QueryState } from "../../components/QueryState";
import { ValueWithError } from "../../components/ValueWithError";
import { RunsTable } from "../runs/RunsTable";
import { BELL_SYMBOL, METHOD_NAME } from "../stateView/meritRows";
import { labPaths } from "./labPaths";
import { RunSearch } from "./RunSearch";

/** A lab's first page: where things stand, what happened lately, and a search over all runs. */
export function LabHome({ labId }: { labId: string }) {
  const lab = useLab(labId);
  const home = useLabHome(labId);
  return (
    <>
      <PageTitle
        subtitle={lab.data ? `${lab.data.institution ? `${lab.data.institution} · ` : ""}you are ${lab.data.role === "owner" ? "an owner" : `a ${lab.data.role}`}` : undefined}
        actions={
          home.data?.can.write && (
            <>
              <ButtonLink variant="secondary" to={labPaths.sources(labId)}>
                Sources
              </ButtonLink>
              <ButtonLink to={labPaths.newSession(labId)}>New session</ButtonLink>
            </>
          )
        }
      >
        {lab.data?.name ?? "Lab"}
      </PageTitle>
      <QueryState query={home} what="the lab's notebook">
        {(h) => (h.totals.sources === 0 ? <FirstSteps labId={labId} canWrite={h.can.write} /> : <Overview labId={labId} home={h} />)}
      </QueryState>
    </>
  );
}

function FirstSteps({ labId, canWrite }: { labId: string; canWrite: boolean }) {
  return (
    <EmptyState title="This lab's notebook is empty" action={canWrite && <ButtonLink to={labPaths.sources(labId)}>Add your pair source</ButtonLink>}>
      {canWrite
        ? "Start with the photon-pair source you characterise; then open a session for a day of measurements, and record runs of counts in it."
        : "Nothing has been recorded yet. Members of the lab add sources, sessions and runs; you will see them here."}
    </EmptyState>
  );
}

function Overview({ labId, home }: { labId: string; home: LabHomeDto }) {
  return (
    <div className="space-y-4">
      <p className="text-sm text-ink-soft">
        {home.totals.sources} source{home.totals.sources === 1 ? "" : "s"} · {home.totals.sessions} session{home.totals.sessions === 1 ? "" : "s"} · {home.totals.runs} run
        {home.totals.runs === 1 ? "" : "s"}
      </p>
      <div className="grid gap-4 lg:grid-cols-2">
        <Panel title="Best state per source">
          <ul className="divide-y divide-paper-sunk">
            {home.bestBySource.map(({ source, best }) => (
              <li key={source.id} className="py-2">
                <div className="flex flex-wrap items-baseline justify-between gap-2">
                  <span className="font-bold">{source.name}</span>
                  {best ? (
                    <span className="text-lg">
                      <span className="text-sm text-ink-soft">F({BELL_SYMBOL[source.targetState]}) = </span>
                      <ValueWithError value={best.fidelity} uncertainty={best.uncertainty} />
                    </span>
                  ) : (
                    <span className="text-sm text-ink-faint">no tomography yet</span>
                  )}
                </div>
                {best && (
                  <p className="text-xs text-ink-faint">
                    <Link className="text-petrol-700 underline" to={labPaths.run(labId, best.run.id)}>
                      {best.run.name}
                    </Link>{" "}
                    in “{best.session.title}” ({best.session.date}); {METHOD_NAME[best.method].toLowerCase()}
                    {best.accidentalsSubtracted ? ", accidentals subtracted" : ""}
                  </p>
                )}
              </li>
            ))}
          </ul>
        </Panel>
        <Panel title="Recent sessions" actions={<Link className="text-sm font-bold text-petrol-700 underline" to={labPaths.newSession(labId)}>New session</Link>}>
          {home.recentSessions.length === 0 ? (
            <EmptyState title="No sessions yet">A session holds one day or series of measurements on one setup. Open one to start recording runs.</EmptyState>
          ) : (
            <ul className="divide-y divide-paper-sunk">
              {home.recentSessions.map((s) => (
                <li key={s.id} className="flex flex-wrap items-baseline justify-between gap-2 py-2">
                  <Link className="font-bold text-petrol-700 underline" to={labPaths.session(labId, s.id)}>
                    {s.title}
                  </Link>
                  <span className="text-sm text-ink-soft">
                    {s.date} · {s.source.name} · {s.runCount} run{s.runCount === 1 ? "" : "s"}
                  </span>
                </li>
              ))}
            </ul>
          )}
        </Panel>
      </div>
      <Panel title="Latest runs">
        <RunsTable labId={labId} runs={home.recentRuns} caption="Latest runs" showSession empty={<EmptyState title="No runs yet">Open a session and enter counts to see runs here.</EmptyState>} />
      </Panel>
      <Panel title="Find runs">
        <RunSearch labId={labId} sources={home.bestBySource.map((b) => b.source)} />
      </Panel>
    </div>
  );
}
