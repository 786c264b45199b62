import { useParams } from "react-router-dom";
import { RequireSignIn } from "../features/account/RequireSignIn";
import { LabHome } from "../features/notebook/LabHome";

export function LabHomePage() {
  const { labId = "" } = useParams();
  return (
    <RequireSignIn>
      <LabHome labId={labId} />
    </RequireSignIn>
  );
}
