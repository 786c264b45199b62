import { useParams } from "react-router-dom";
import { RequireSignIn } from "../features/account/RequireSignIn";
import { LabOverview } from "../features/labs/LabOverview";

/** /labs/:labId until the notebook's lab home page takes this route. */
export function LabPage() {
  const { labId = "" } = useParams();
  return (
    <RequireSignIn>
      <LabOverview labId={labId} />
    </RequireSignIn>
  );
}
