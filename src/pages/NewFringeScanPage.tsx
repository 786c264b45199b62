import { useParams } from "react-router-dom";
import { useLabSession } from "../api/labSessions";
import { BackLink } from "../components/BackLink";
import { PageTitle } from "../components/PageTitle";
import { QueryState } from "../components/QueryState";
import { RequireSignIn } from "../features/account/RequireSignIn";
import { FringeEntryForm } from "../features/fringe/FringeEntryForm";

export function NewFringeScanPage() {
  const { labId = "", sessionId = "" } = useParams();
  const session = useLabSession(labId, sessionId);
  return (
    <RequireSignIn>
      <QueryState query={session} what="the session">
        {(s) => (
          <>
            <BackLink to={`/labs/${labId}/sessions/${sessionId}`}>{s.title}</BackLink>
            <PageTitle subtitle="Coincidences against arm B's polariser angle, with arm A fixed; one scan per setting of arm A.">New fringe scan</PageTitle>
            <FringeEntryForm labId={labId} sessionId={sessionId} />
          </>
        )}
      </QueryState>
    </RequireSignIn>
  );
}
