import { useParams } from "react-router-dom";
import { RequireSignIn } from "../features/account/RequireSignIn";
import { CompareView } from "../features/compare/CompareView";

export function ComparePage() {
  const { labId = "" } = useParams();
  return (
    <RequireSignIn>
      <CompareView labId={labId} />
    </RequireSignIn>
  );
}
