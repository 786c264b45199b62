import { useParams } from "react-router-dom";
import { RequireSignIn } from "../features/account/RequireSignIn";
import { BatchView } from "../features/batches/BatchView";

export function BatchPage() {
  const { labId = "", batchId = "" } = useParams();
  return (
    <RequireSignIn>
      <BatchView labId={labId} batchId={batchId} />
    </RequireSignIn>
  );
}
