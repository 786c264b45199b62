import { Link, useParams } from "react-router-dom";
import { useLab } from "../api/labs";
import { BackLink } from "../components/BackLink";
import { PageTitle } from "../components/PageTitle";
import { Panel } from "../components/Panel";
import { QueryState } from "../components/QueryState";
import { RequireSignIn } from "../features/account/RequireSignIn";
import { exportPaths } from "../features/exports/exportPaths";
import { ShareList } from "../features/sharing/ShareList";

/** /labs/:labId/shares — every share of the lab: what, to whom, by whom, its state; revoke. */
export function LabSharesPage() {
  const { labId = "" } = useParams();
  const lab = useLab(labId);
  return (
    <RequireSignIn>
      <QueryState query={lab} what="the lab">
        {(l) => (
          <>
            <BackLink to={`/labs/${l.id}`}>{l.name}</BackLink>
            <PageTitle subtitle="Links and guest shares that open one session, run or state read-only to people outside the lab. Share an item from its page.">Shares</PageTitle>
            <Panel title="All shares, newest first">
              <ShareList labId={labId} canRevoke={l.can.write} showItem />
            </Panel>
            {l.can.write && (
              <p className="mt-4 text-sm">
                Moving a session from another lab?{" "}
                <Link className="font-bold text-petrol-700 underline" to={exportPaths.importBundle(labId)}>
                  Import a session bundle
                </Link>
                .
              </p>
            )}
          </>
        )}
      </QueryState>
    </RequireSignIn>
  );
}
