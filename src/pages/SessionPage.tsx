import { useParams } from "react-router-dom";
import { RequireSignIn } from "../features/account/RequireSignIn";
import { SessionView } from "../features/labSessions/SessionView";

export function SessionPage() {
  const { labId = "", sessionId = "" } = useParams();
  return (
    <RequireSignIn>
      <SessionView key={sessionId} labId={labId} sessionId={sessionId} />
    </RequireSignIn>
  );
}
