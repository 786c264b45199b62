import { Link, useParams, useSearchParams } from "react-router-dom";
import type { BellAngles } from "@shared/physics/bell";
import { BackLink } from "../components/BackLink";
import { PageTitle } from "../components/PageTitle";
import { Panel } from "../components/Panel";
import { QueryState } from "../components/QueryState";
import { RequireSignIn } from "../features/account/RequireSignIn";
import { BellAnglesForm } from "../features/bell/BellAnglesForm";
import { BellResults } from "../features/bell/BellResults";
import { ComparisonPicker } from "../features/bell/ComparisonPicker";
import { useBellTest } from "../features/bell/useBellTest";

/** The angles and the compared reconstruction live in the address (?a=&a2=&b=&b2=&rec=), so a link reproduces exactly this analysis. */
function anglesFromSearch(search: URLSearchParams): BellAngles | undefined {
  const values = ["a", "a2", "b", "b2"].map((k) => search.get(k));
  if (values.some((v) => v === null || v === "" || !Number.isFinite(Number(v)))) return undefined;
  const [aDeg, aPrimeDeg, bDeg, bPrimeDeg] = values.map(Number);
  return { aDeg, aPrimeDeg, bDeg, bPrimeDeg };
}

export function BellTestPage() {
  const { labId = "", runId = "" } = useParams();
  return (
    <RequireSignIn>
      <BellTest labId={labId} runId={runId} />
    </RequireSignIn>
  );
}

function BellTest({ labId, runId }: { labId: string; runId: string }) {
  const [search, setSearch] = useSearchParams();
  const angles = anglesFromSearch(search);
  const reconstructionId = search.get("rec") ?? undefined;
  const test = useBellTest(labId, runId, angles, reconstructionId);
  const update = (changes: Record<string, string | undefined>) => {
    const next = new URLSearchParams(search);
    for (const [k, v] of Object.entries(changes)) {
      if (v === undefined) next.delete(k);
      else next.set(k, v);
    }
    setSearch(next, { replace: true });
  };
  const apply = (a: BellAngles | undefined) =>
    update(a ? { a: String(a.aDeg), a2: String(a.aPrimeDeg), b: String(a.bDeg), b2: String(a.bPrimeDeg) } : { a: undefined, a2: undefined, b: undefined, b2: undefined });
  return (
    <>
      <BackLink to={`/labs/${labId}/runs/${runId}`}>Run</BackLink>
      <QueryState query={test} what="the Bell test">
        {(t) => (
          <>
            <PageTitle subtitle="CHSH from the measured coincidences, beside what the session's reconstructed state predicts.">{`Bell test — ${t.runName}`}</PageTitle>
            <div className="space-y-4">
              <ComparisonPicker labId={labId} sessionId={t.sessionId} value={reconstructionId} onChange={(rec) => update({ rec })} />
              <BellResults test={t} runName={t.runName} />
              <Panel title="Analyser angles">
                <BellAnglesForm key={JSON.stringify(t.angles)} angles={t.angles} onApply={apply} />
              </Panel>
              <p className="text-sm text-ink-soft">
                Follow this source over time on the <Link className="font-bold text-petrol-700 underline" to={`/labs/${labId}/trends?sessionId=${t.sessionId}&figure=chshAbsS`}>session's trends</Link>.
              </p>
            </div>
          </>
        )}
      </QueryState>
    </>
  );
}
