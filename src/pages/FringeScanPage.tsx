import { useParams, useSearchParams } from "react-router-dom";
import { useLabSession } from "../api/labSessions";
import { BackLink } from "../components/BackLink";
import { PageTitle } from "../components/PageTitle";
import { Panel } from "../components/Panel";
import { QueryState } from "../components/QueryState";
import { RequireSignIn } from "../features/account/RequireSignIn";
import { BackgroundControls } from "../features/fringe/BackgroundControls";
import { FringeResults } from "../features/fringe/FringeResults";
import { type BackgroundChoice, useFringeFit } from "../features/fringe/useFringeFit";

/** The background choice lives in the address, so a link reproduces the same fit. */
function choiceFromSearch(search: URLSearchParams): BackgroundChoice {
  const kind = search.get("background");
  if (kind === "accidentals") return { background: "accidentals" };
  if (kind === "rate") return { background: "rate", backgroundRate: Number(search.get("rate") ?? 0) || 0, backgroundSigma: Number(search.get("sigma") ?? 0) || 0 };
  return { background: "none" };
}

export function FringeScanPage() {
  const { labId = "", runId = "" } = useParams();
  return (
    <RequireSignIn>
      <FringeScan labId={labId} runId={runId} />
    </RequireSignIn>
  );
}

function FringeScan({ labId, runId }: { labId: string; runId: string }) {
  const [search, setSearch] = useSearchParams();
  const choice = choiceFromSearch(search);
  const fit = useFringeFit(labId, runId, choice);
  const setChoice = (c: BackgroundChoice) =>
    setSearch(c.background === "rate" ? { background: "rate", rate: String(c.backgroundRate), sigma: String(c.backgroundSigma) } : c.background === "accidentals" ? { background: "accidentals" } : {}, { replace: true });
  return (
    <>
      <BackLink to={`/labs/${labId}/runs/${runId}`}>Run</BackLink>
      <QueryState query={fit} what="the fringe fit">
        {(a) => (
          <>
            <PageTitle subtitle="Coincidences against the analyser angle, with visibility fits per setting of the fixed arm.">{`Fringe scan — ${a.runName}`}</PageTitle>
            <div className="space-y-4">
              <Panel title="Background">
                <SessionWindow labId={labId} sessionId={a.sessionId} choice={choice} onChange={setChoice} />
                <p className="mt-2 text-xs text-ink-faint">
                  A fringe cannot tell a constant background from its mean, so the background is given rather than fitted; with “None” the visibility is that of the raw fringe.
                </p>
              </Panel>
              <FringeResults analysis={a} />
            </div>
          </>
        )}
      </QueryState>
    </>
  );
}

function SessionWindow({ labId, sessionId, choice, onChange }: { labId: string; sessionId: string; choice: BackgroundChoice; onChange: (c: BackgroundChoice) => void }) {
  const session = useLabSession(labId, sessionId);
  return <BackgroundControls value={choice} onChange={onChange} sessionWindowNs={session.data?.coincidenceWindowNs ?? null} />;
}
