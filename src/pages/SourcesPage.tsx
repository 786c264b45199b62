import { useParams } from "react-router-dom";
import { RequireSignIn } from "../features/account/RequireSignIn";
import { SourcesView } from "../features/sources/SourcesView";

export function SourcesPage() {
  const { labId = "" } = useParams();
  return (
    <RequireSignIn>
      <SourcesView labId={labId} />
    </RequireSignIn>
  );
}
