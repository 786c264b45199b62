import { useParams } from "react-router-dom";
import { useLabSession } from "../api/labSessions";
import { BackLink } from "../components/BackLink";
import { PageTitle } from "../components/PageTitle";
import { QueryState } from "../components/QueryState";
import { RequireSignIn } from "../features/account/RequireSignIn";
import { BellEntryForm } from "../features/bell/BellEntryForm";

export function NewBellTestPage() {
  const { labId = "", sessionId = "" } = useParams();
  const session = useLabSession(labId, sessionId);
  return (
    <RequireSignIn>
      <QueryState query={session} what="the session">
        {(s) => (
          <>
            <BackLink to={`/labs/${labId}/sessions/${sessionId}`}>{s.title}</BackLink>
            <PageTitle subtitle="Sixteen coincidence counts: four analyser pairs, each with its orthogonal outcomes.">New Bell test</PageTitle>
            <BellEntryForm labId={labId} sessionId={sessionId} />
          </>
        )}
      </QueryState>
    </RequireSignIn>
  );
}
