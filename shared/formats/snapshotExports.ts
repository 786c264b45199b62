/**
 * Export files of a snapshot (what a share or a report shows). The server answers the lab's
 * export routes with these, and a shared page builds the same files in the browser from the
 * snapshot it already has — one set of functions, so a file looks the same wherever it is saved.
 */
import type { ExportContext } from "../schemas/exports";
import type { Snapshot, SnapshotReconstruction, SnapshotRun } from "../schemas/shares";
import type { CountsRowDto } from "../schemas/runs";
import { countsCsv, metricsCsv, rhoCsv } from "./exportCsv";
import { jsonText, metricsJson, rhoJson } from "./exportJson";

export interface ExportFile {
  fileName: string;
  contentType: string;
  text: string;
}

export type ReconstructionFileKind = "rho.csv" | "rho.json" | "metrics.csv" | "metrics.json";

const CSV = "text/csv; charset=utf-8";
const JSON_TYPE = "application/json; charset=utf-8";

/** Lower-case, dash-separated, safe in every file system. */
export function fileStem(text: string): string {
  return text.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "").slice(0, 80) || "export";
}

export function contextOf(snapshot: Snapshot, run: SnapshotRun, revision = run.revisionNumber): ExportContext {
  return { source: snapshot.setup.source.name, session: snapshot.setup.session.title, sessionDate: snapshot.setup.session.date, run: run.name, revision };
}

/** The run's shown counts, or another revision's rows when given. */
export function countsFile(snapshot: Snapshot, run: SnapshotRun, other?: { number: number; rows: CountsRowDto[] }, now = new Date()): ExportFile {
  const revision = other?.number ?? run.revisionNumber;
  return {
    fileName: `${fileStem(run.name)}-counts-r${revision}.csv`,
    contentType: CSV,
    text: countsCsv(contextOf(snapshot, run, revision), other?.rows ?? run.rows, now),
  };
}

export function reconstructionFile(snapshot: Snapshot, run: SnapshotRun, rec: SnapshotReconstruction, kind: ReconstructionFileKind): ExportFile {
  const context = contextOf(snapshot, run, rec.revisionNumber);
  const fileName = `${fileStem(run.name)}-${rec.method}-${kind}`;
  switch (kind) {
    case "rho.csv":
      return { fileName, contentType: CSV, text: rhoCsv(rec) };
    case "rho.json":
      return { fileName, contentType: JSON_TYPE, text: jsonText(rhoJson(context, rec)) };
    case "metrics.csv":
      return { fileName, contentType: CSV, text: metricsCsv([{ context, reconstruction: rec }]) };
    case "metrics.json":
      return { fileName, contentType: JSON_TYPE, text: jsonText(metricsJson([{ context, reconstruction: rec }])) };
  }
}

/** Figures of merit of every reconstruction in the snapshot (a whole session's, for a session). */
export function snapshotMetricsFile(snapshot: Snapshot, kind: "metrics.csv" | "metrics.json"): ExportFile {
  const items = snapshot.runs.flatMap((run) => run.reconstructions.map((reconstruction) => ({ context: contextOf(snapshot, run, reconstruction.revisionNumber), reconstruction })));
  const fileName = `${fileStem(snapshot.title)}-${kind}`;
  return kind === "metrics.csv"
    ? { fileName, contentType: CSV, text: metricsCsv(items) }
    : { fileName, contentType: JSON_TYPE, text: jsonText(metricsJson(items)) };
}
