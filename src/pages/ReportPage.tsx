import { useParams } from "react-router-dom";
import { ShareItemTypeSchema } from "@shared/schemas/shares";
import { RequireSignIn } from "../features/account/RequireSignIn";
import { ReportView } from "../features/reports/ReportView";
import { NotFoundPage } from "./NotFoundPage";

/** /labs/:labId/reports/:itemType/:itemId — the printable report of a session, run or reconstruction. */
export function ReportPage() {
  const { labId = "", itemType = "", itemId = "" } = useParams();
  const type = ShareItemTypeSchema.safeParse(itemType);
  if (!type.success) return <NotFoundPage />;
  return (
    <RequireSignIn>
      <ReportView key={itemId} labId={labId} itemType={type.data} itemId={itemId} />
    </RequireSignIn>
  );
}
