import type { ShareItemType } from "@shared/schemas/shares";
import { ExportMenu } from "../exports/ExportMenu";
import { ShareButton } from "./ShareButton";

/** The "Share" and "Export" buttons of a session, run or reconstruction page. */
export function ShareExportActions({ labId, itemType, itemId, can }: { labId: string; itemType: ShareItemType; itemId: string; can: { write: boolean } }) {
  return (
    <div className="flex items-center gap-2 print:hidden">
      <ShareButton labId={labId} itemType={itemType} itemId={itemId} canWrite={can.write} />
      <ExportMenu labId={labId} itemType={itemType} itemId={itemId} />
    </div>
  );
}
