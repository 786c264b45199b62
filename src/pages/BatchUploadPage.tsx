import { useParams, useSearchParams } from "react-router-dom";
import { RequireSignIn } from "../features/account/RequireSignIn";
import { BatchUploadView } from "../features/batches/BatchUploadView";

export function BatchUploadPage() {
  const { labId = "" } = useParams();
  const [search] = useSearchParams();
  return (
    <RequireSignIn>
      <BatchUploadView key={labId} labId={labId} initialSessionId={search.get("session")} />
    </RequireSignIn>
  );
}
