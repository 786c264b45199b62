import { useParams } from "react-router-dom";
import { RequireSignIn } from "../features/account/RequireSignIn";
import { NewRunView } from "../features/countsEntry/NewRunView";

export function NewRunPage() {
  const { labId = "", sessionId = "" } = useParams();
  return (
    <RequireSignIn>
      <NewRunView key={sessionId} labId={labId} sessionId={sessionId} />
    </RequireSignIn>
  );
}
