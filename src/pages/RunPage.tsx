import { useParams } from "react-router-dom";
import { RequireSignIn } from "../features/account/RequireSignIn";
import { RunView } from "../features/runs/RunView";

export function RunPage() {
  const { labId = "", runId = "" } = useParams();
  return (
    <RequireSignIn>
      <RunView key={runId} labId={labId} runId={runId} />
    </RequireSignIn>
  );
}
