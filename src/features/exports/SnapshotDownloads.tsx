import { countsFile, reconstructionFile, snapshotMetricsFile } from "@shared/formats/snapshotExports";
import type { Snapshot, SnapshotReconstruction, SnapshotRun } from "@shared/schemas/shares";
import { FileLink } from "./FileLink";

/**
 * Downloads of what a shared page shows, made in the browser from the snapshot it loaded (the
 * same files the lab's export routes send), so a collaborator needs no account to save them.
 */
export function RunDownloads({ snapshot, run, reconstruction }: { snapshot: Snapshot; run: SnapshotRun; reconstruction?: SnapshotReconstruction }) {
  return (
    <p className="flex flex-wrap gap-x-4 gap-y-1 text-sm print:hidden" aria-label="Downloads">
      <span className="text-ink-faint">Download:</span>
      <FileLink file={countsFile(snapshot, run)}>counts (CSV)</FileLink>
      {reconstruction && (
        <>
          <FileLink file={reconstructionFile(snapshot, run, reconstruction, "rho.csv")}>ρ (CSV)</FileLink>
          <FileLink file={reconstructionFile(snapshot, run, reconstruction, "rho.json")}>ρ (JSON)</FileLink>
          <FileLink file={reconstructionFile(snapshot, run, reconstruction, "metrics.csv")}>figures of merit (CSV)</FileLink>
          <FileLink file={reconstructionFile(snapshot, run, reconstruction, "metrics.json")}>figures of merit (JSON)</FileLink>
        </>
      )}
    </p>
  );
}

export function SessionDownloads({ snapshot }: { snapshot: Snapshot }) {
  return (
    <p className="flex flex-wrap gap-x-4 gap-y-1 text-sm print:hidden" aria-label="Downloads">
      <span className="text-ink-faint">Download every run's figures of merit:</span>
      <FileLink file={snapshotMetricsFile(snapshot, "metrics.csv")}>CSV</FileLink>
      <FileLink file={snapshotMetricsFile(snapshot, "metrics.json")}>JSON</FileLink>
    </p>
  );
}
