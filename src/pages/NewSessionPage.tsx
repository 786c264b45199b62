import { useParams } from "react-router-dom";
import { RequireSignIn } from "../features/account/RequireSignIn";
import { NewSessionView } from "../features/labSessions/NewSessionView";

export function NewSessionPage() {
  const { labId = "" } = useParams();
  return (
    <RequireSignIn>
      <NewSessionView labId={labId} />
    </RequireSignIn>
  );
}
