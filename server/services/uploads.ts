import { createHash } from "node:crypto";
import { ZodError } from "zod";
import { parseTomographyCsv, TomographyCsvError } from "@shared/formats/tomographyCsv";
import { decodeUtf8Text } from "@shared/formats/utf8Text";
import { standardSet, type StandardSetId } from "@shared/physics";
import { CreateRunSchema, type SettingSetId, type UploadRunFields } from "@shared/schemas/runs";
import type { AuthUser } from "../http/auth";
import { HttpError, invalid } from "../http/errors";
import { createRun, type UploadedFile } from "./runs";
import type { RunDetail } from "./runQueries";

const RECOGNISED_SETS: StandardSetId[] = ["tomo16", "tomo36"];

export interface IncomingFile {
  originalname: string;
  mimetype: string;
  buffer: Buffer;
}

/**
 * A run from one uploaded counts CSV (shared/formats/tomographyCsv.ts): parse, check the rows
 * with the same schema as JSON runs, then save run, reconstructions and the file (bytes as they
 * came, with their SHA-256) in one transaction. Any error names the file's line and column and
 * nothing is stored.
 */
export async function uploadRun(user: AuthUser, labId: string, sessionId: string, file: IncomingFile | undefined, fields: UploadRunFields): Promise<RunDetail> {
  if (!file) throw invalid("file", "Choose a counts file (CSV) to upload in the form field “file”.");
  const text = decodeUtf8(file.buffer);
  let parsed: ReturnType<typeof parseTomographyCsv>;
  try {
    parsed = parseTomographyCsv(text);
  } catch (e) {
    if (e instanceof TomographyCsvError) throw fileError(e.message, e.row, e.column);
    throw e;
  }
  const kind = fields.kind ?? "tomography";
  const labels = parsed.rows.every((r) => typeof r.setting === "string") ? parsed.rows.map((r) => r.setting as string) : null;
  const input = {
    kind,
    settingSetId: fields.settingSetId ?? (labels && kind === "tomography" ? recogniseSet(labels) : "custom"),
    name: fields.name ?? (file.originalname.replace(/\.[^.]*$/, "").trim().slice(0, 120) || "Uploaded run"),
    notes: fields.notes ?? parsed.comments.join("\n"),
    conditions: { pumpPowerMw: fields.pumpPowerMw ?? null },
    rows: parsed.rows.map((r) => ({ setting: r.setting, counts: r.counts, seconds: r.seconds ?? 1, singlesA: r.singlesA ?? null, singlesB: r.singlesB ?? null, monitor: r.monitor ?? null })),
  };
  const run = CreateRunSchema.safeParse(input);
  if (!run.success) throw rowIssues(run.error, parsed.lines);
  const stored: UploadedFile = {
    fileName: file.originalname.slice(0, 255) || "upload.csv",
    contentType: file.mimetype || "text/csv",
    content: file.buffer,
    sha256: createHash("sha256").update(file.buffer).digest("hex"),
  };
  try {
    return await createRun(user, labId, sessionId, run.data, stored);
  } catch (e) {
    throw e instanceof HttpError ? withLines(e, parsed.lines) : e;
  }
}

function decodeUtf8(buffer: Buffer): string {
  const decoded = decodeUtf8Text(buffer);
  if (!decoded.ok) throw invalid("file", `The file is not UTF-8 text (${decoded.reason}); save it as CSV (UTF-8) and upload again.`);
  return decoded.text;
}

/** tomo16 or tomo36 when the labels are exactly that set (in any order), else custom. */
function recogniseSet(labels: string[]): SettingSetId {
  const sorted = [...labels].sort().join();
  return RECOGNISED_SETS.find((id) => [...standardSet(id).labels].sort().join() === sorted) ?? "custom";
}

function fileError(message: string, line: number | null, column: string | null): HttpError {
  return new HttpError(400, "invalid", `The file was not saved: ${message}`, [{ field: "file", message, ...(line !== null && { line }), ...(column !== null && { column }) }]);
}

const CSV_COLUMN: Record<string, string> = { setting: "basis", counts: "counts", seconds: "seconds", singlesA: "singles_a", singlesB: "singles_b", monitor: "monitor" };

/** rows.i.setting.j.qwpDeg → the file's column arm_<letter>_qwp_deg. */
function angleColumn(path: PropertyKey[]): string | null {
  const [, , field, arm, plate] = path;
  if (field !== "setting" || typeof arm !== "number") return null;
  const letter = "abcd"[arm];
  return plate === "qwpDeg" ? `arm_${letter}_qwp_deg` : plate === "hwpDeg" ? `arm_${letter}_hwp_deg` : plate === "port" ? `arm_${letter}_port` : null;
}

/** Schema issues on rows.i.field → the file's line and CSV column. */
function rowIssues(error: ZodError, lines: number[]): HttpError {
  const details = error.issues.map((issue) => {
    const [head, index, field] = issue.path;
    if (head === "rows" && typeof index === "number") {
      const column = angleColumn(issue.path) ?? (typeof field === "string" ? CSV_COLUMN[field] ?? field : null);
      const where = column ? `row ${lines[index]}, column "${column}"` : `row ${lines[index]}`;
      return { field: "file", message: `${where}: ${issue.message}`, line: lines[index], ...(column && { column }) };
    }
    return { field: issue.path[0] === "rows" ? "file" : issue.path.join(".") || "file", message: issue.message };
  });
  return new HttpError(400, "invalid", `The file was not saved: ${details.map((d) => d.message).join("; ")}`, details);
}

/** Engine errors name "rows.3.singlesA"; for a file, say line and column instead. */
function withLines(e: HttpError, lines: number[]): HttpError {
  if (!Array.isArray(e.details)) return e;
  const details = e.details.map((d) => {
    const m = /^rows\.(\d+)\.(\w+)$/.exec(String(d.field));
    if (!m) return d;
    const line = lines[Number(m[1])];
    const column = CSV_COLUMN[m[2]] ?? m[2];
    return { field: "file", message: `row ${line}, column "${column}": ${d.message}`, line, column };
  });
  return new HttpError(e.status, e.code, `The file was not saved: ${details.map((d) => d.message).join("; ")}`, details);
}
