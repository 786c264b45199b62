import { useEffect, useMemo } from "react";
import type { ExportFile } from "@shared/formats/snapshotExports";

/** An object URL for a file built in the browser, released when the file changes or the link goes. */
export function useFileUrl(file: ExportFile): string {
  const url = useMemo(() => URL.createObjectURL(new Blob([file.text], { type: file.contentType })), [file.text, file.contentType]);
  useEffect(() => () => URL.revokeObjectURL(url), [url]);
  return url;
}
