import { useEffect } from "react";
import { useParams } from "react-router-dom";
import { useSharedLink } from "../api/shares";
import { Button } from "../components/Button";
import { DocumentFrame } from "../features/sharing/DocumentFrame";
import { ShareProblem } from "../features/sharing/ShareProblem";
import { SharedBanner } from "../features/sharing/SharedBanner";
import { SnapshotView } from "../features/sharing/SnapshotView";

/** /shared/:token — what a share link opens, for anyone holding the link; no account needed. */
export function SharedLinkPage() {
  const { token = "" } = useParams();
  const view = useSharedLink(token);
  useEffect(() => {
    document.title = view.data ? `${view.data.snapshot.title} (shared) · Rhomb` : "Shared item · Rhomb";
  }, [view.data]);
  return (
    <DocumentFrame toolbar={view.data && <Button variant="secondary" size="sm" onClick={() => window.print()}>Print or save as PDF</Button>}>
      {view.isPending && <p className="py-6 text-ink-faint" role="status">Opening the shared item…</p>}
      {view.isError && <ShareProblem error={view.error} />}
      {view.data && <SnapshotView snapshot={view.data.snapshot} mode="screen" banner={<SharedBanner share={view.data.share} />} />}
    </DocumentFrame>
  );
}
