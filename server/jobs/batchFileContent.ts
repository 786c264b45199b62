import { parseRunJson, RunFileError, type FileIssue } from "@shared/formats/runJson";
import { parseSweepCsv, readSweepCsv, sweepColumnOf } from "@shared/formats/sweepCsv";
import type { BatchFileFormat } from "@shared/schemas/batches";
import { decodeUtf8Text } from "@shared/formats/utf8Text";
import type { CreateRun } from "@shared/schemas/runs";
import { HttpError } from "../http/errors";

/**
 * Reading the content of one batch file. One-run CSVs go to the notebook's own upload service
 * (services/uploads.ts), which parses them; JSON files and sweep lines are parsed here into the
 * run the notebook's createRun stores.
 */

/**
 * The name of the file a batch file came from, on its own: "runs.zip › day1/5mW.csv" →
 * "5mW.csv", "sweep.csv › row 7" → "sweep.csv".
 */
export function baseName(displayName: string): string {
  const last = displayName.replace(/ › row \d+$/, "").split(" › ").pop()!;
  return last.split("/").pop() || last;
}

export function stem(name: string): string {
  return name.replace(/\.[^.]*$/, "").trim().slice(0, 100) || "Uploaded run";
}

/** The file's text (shared/formats/utf8Text.ts), or a file error that says why it is not. */
export function decodeText(bytes: Uint8Array): string {
  const decoded = decodeUtf8Text(bytes);
  if (decoded.ok) return decoded.text;
  throw new RunFileError([{ row: null, column: null, message: `the file is not UTF-8 text: ${decoded.reason}; save it as CSV or JSON in UTF-8 and upload it again` }]);
}

/** The run of a JSON file or a sweep line (one-run CSVs are parsed by the upload service). */
export function parseRunContent(format: Exclude<BatchFileFormat, "run-csv">, content: Buffer, fileName: string, sourceLine: number | null): CreateRun {
  const text = decodeText(content);
  if (format === "run-json") return parseRunJson(text, { fallbackName: stem(baseName(fileName)) });
  const [only] = parseSweepCsv(text, { fallbackName: stem(baseName(fileName)), firstLine: sourceLine ?? undefined });
  if ("error" in only) throw only.error;
  return only.run;
}

/**
 * The API's field-level errors (details [{ field: "rows.3.counts", message }], or the upload
 * service's [{ field: "file", line, column, message }]) as rows and columns of this file.
 */
export function issuesOf(error: HttpError, format: BatchFileFormat, content: Buffer, sourceLine: number | null): FileIssue[] {
  const details = Array.isArray(error.details) ? (error.details as Array<Record<string, unknown>>) : [];
  if (details.length === 0) return [{ row: null, column: null, message: error.message }];
  const labels = format === "sweep-line" ? readSweepCsv(decodeText(content)).header.labels : [];
  return details.map((d) => {
    const message = String(d.message ?? error.message).replace(/^row \d+(, column "[^"]*")?: /, "");
    if (typeof d.line === "number") return { row: d.line, column: typeof d.column === "string" ? d.column : null, message };
    const path = String(d.field ?? "").split(".").map((p) => (/^\d+$/.test(p) ? Number(p) : p));
    if (format === "sweep-line") return { row: sourceLine, column: sweepColumnOf(path, labels), message };
    if (path[0] === "rows" && typeof path[1] === "number") return { row: path[1] + 1, column: path.slice(2).join(".") || "setting", message };
    return { row: null, column: path.join(".") || null, message };
  });
}
