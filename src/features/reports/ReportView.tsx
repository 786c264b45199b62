import { useEffect } from "react";
import type { ShareItemType } from "@shared/schemas/shares";
import { useReport } from "../../api/shares";
import { BackLink } from "../../components/BackLink";
import { Button } from "../../components/Button";
import { QueryState } from "../../components/QueryState";
import { labPaths } from "../notebook/labPaths";
import { DocumentFrame } from "../sharing/DocumentFrame";
import { SnapshotView } from "../sharing/SnapshotView";
import "./print.css";

const BACK: Record<ShareItemType, { label: string; to: (labId: string, id: string) => string }> = {
  session: { label: "Back to the session", to: labPaths.session },
  run: { label: "Back to the run", to: labPaths.run },
  reconstruction: { label: "Back to the lab", to: (labId) => labPaths.home(labId) },
};

/**
 * A printable report of a session, run or reconstruction: the same content a share shows, laid
 * out for paper (flat bars and tables instead of 3D; every run of a session, one per page).
 */
export function ReportView({ labId, itemType, itemId }: { labId: string; itemType: ShareItemType; itemId: string }) {
  const report = useReport(labId, itemType, itemId);
  useEffect(() => {
    if (report.data) document.title = `${report.data.title} — report · Rhomb`;
  }, [report.data]);
  const back = BACK[itemType];
  return (
    <DocumentFrame
      toolbar={
        <>
          <BackLink inline to={back.to(labId, itemId)}>{back.label}</BackLink>
          <Button size="sm" onClick={() => window.print()} disabled={!report.data}>
            Print or save as PDF
          </Button>
        </>
      }
    >
      <div className="rhomb-report">
        <QueryState query={report} what="the report">
          {(snapshot) => <SnapshotView snapshot={snapshot} mode="print" />}
        </QueryState>
      </div>
    </DocumentFrame>
  );
}
