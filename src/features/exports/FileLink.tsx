import type { ExportFile } from "@shared/formats/snapshotExports";
import { useFileUrl } from "./useFileUrl";

export const fileLinkClass = "font-bold text-petrol-700 underline decoration-petrol-100 underline-offset-2 hover:decoration-petrol-700";

/** A download link for a file made in the browser from data already on the page. */
export function FileLink({ file, children }: { file: ExportFile; children: React.ReactNode }) {
  return (
    <a className={fileLinkClass} href={useFileUrl(file)} download={file.fileName}>
      {children}
    </a>
  );
}
