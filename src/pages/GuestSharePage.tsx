import { useParams } from "react-router-dom";
import { useGuestShare } from "../api/shares";
import { BackLink } from "../components/BackLink";
import { Button } from "../components/Button";
import { RequireSignIn } from "../features/account/RequireSignIn";
import { ShareProblem } from "../features/sharing/ShareProblem";
import { SharedBanner } from "../features/sharing/SharedBanner";
import { SnapshotView } from "../features/sharing/SnapshotView";

/** /guest/:shareId — an item shared with the signed-in person's e-mail address. */
export function GuestSharePage() {
  const { shareId = "" } = useParams();
  return (
    <RequireSignIn>
      <GuestShare shareId={shareId} />
    </RequireSignIn>
  );
}

function GuestShare({ shareId }: { shareId: string }) {
  const view = useGuestShare(shareId);
  return (
    <>
      <div className="mb-3 flex flex-wrap items-center justify-between gap-2 print:hidden">
        <BackLink inline to="/shared-with-me">Shared with me</BackLink>
        {view.data && (
          <Button variant="secondary" size="sm" onClick={() => window.print()}>
            Print or save as PDF
          </Button>
        )}
      </div>
      {view.isPending && <p className="py-6 text-ink-faint" role="status">Opening the shared item…</p>}
      {view.isError && <ShareProblem error={view.error} />}
      {view.data && <SnapshotView snapshot={view.data.snapshot} mode="screen" banner={<SharedBanner share={view.data.share} />} />}
    </>
  );
}
