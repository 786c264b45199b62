/**
 * Rhomb's one-run JSON file — the same fields as the API's CreateRun body, so a script can write
 * the file it would otherwise post:
 *
 *   { "format": "rhomb-run/1", "name": "5 mW", "settingSetId": "tomo16",
 *     "conditions": { "pumpPowerMw": 5 },
 *     "rows": [ { "setting": "HH", "counts": 1234, "seconds": 1, "singlesA": 40000, "singlesB": 38000 }, … ] }
 *
 * - "format" is optional; when present it must be "rhomb-run/1".
 * - "name" defaults to the file name; "settingSetId" to the standard set whose settings the rows
 *   name exactly (otherwise "custom").
 * Errors name the entry of "rows" (1-based, as people count) and the key, e.g.
 *   row 4, column "counts": Counts cannot be negative.
 */
import type { z } from "zod";
import { CreateRunSchema, type CreateRun } from "../schemas/runs";
import { standardSet, type StandardSetId } from "../physics/settings";

export const RUN_JSON_FORMAT = "rhomb-run/1";

/** One problem in a file: `row` is a file line (CSV) or an entry of "rows" (JSON), 1-based. */
export interface FileIssue {
  row: number | null;
  column: string | null;
  message: string;
}

export class RunFileError extends Error {
  constructor(readonly issues: FileIssue[]) {
    super(issues.map(describeIssue).join("; "));
    this.name = "RunFileError";
  }
}

export function describeIssue(issue: FileIssue): string {
  const where = [issue.row !== null ? `row ${issue.row}` : null, issue.column !== null ? `column "${issue.column}"` : null].filter(Boolean).join(", ");
  return where ? `${where}: ${issue.message}` : issue.message;
}

export interface RunFileOptions {
  /** Name for a run whose file gives none (usually the file name without extension). */
  fallbackName?: string;
  /** Reconstruction options for a run whose file gives none (a batch's choice). */
  reconstruction?: z.input<typeof CreateRunSchema>["reconstruction"];
}

export function parseRunJson(text: string, options: RunFileOptions = {}): CreateRun {
  let raw: unknown;
  try {
    raw = JSON.parse(text.replace(/^\uFEFF/, ""));
  } catch (e) {
    throw new RunFileError([{ row: null, column: null, message: `not valid JSON (${(e as Error).message})` }]);
  }
  if (!raw || typeof raw !== "object" || Array.isArray(raw)) {
    throw new RunFileError([{ row: null, column: null, message: "a run file holds one JSON object with the run's fields and its \"rows\"" }]);
  }
  const doc = raw as Record<string, unknown>;
  if (doc.format !== undefined && doc.format !== RUN_JSON_FORMAT) {
    throw new RunFileError([{ row: null, column: "format", message: `"${String(doc.format)}" is not a layout we read (expected "${RUN_JSON_FORMAT}")` }]);
  }
  const { format: _format, ...fields } = doc;
  const rows = Array.isArray(fields.rows) ? fields.rows : [];
  const labels = rows.map((r) => (r && typeof r === "object" ? (r as { setting?: unknown }).setting : undefined));
  return validateRun(
    {
      ...(options.fallbackName && { name: options.fallbackName }),
      ...(options.reconstruction && { reconstruction: options.reconstruction }),
      settingSetId: inferSettingSetId(labels),
      ...fields,
    },
    (path) => (path[0] === "rows" && typeof path[1] === "number" ? { row: path[1] + 1, column: path.slice(2).join(".") || "setting" } : { row: null, column: path.join(".") || null }),
  );
}

/** Validates a run with the API's own schema; `locate` turns a zod path into a row and column. */
export function validateRun(input: unknown, locate: (path: PropertyKey[]) => { row: number | null; column: string | null }): CreateRun {
  const parsed = CreateRunSchema.safeParse(input);
  if (parsed.success) return parsed.data;
  throw new RunFileError(parsed.error.issues.map((i) => ({ ...locate(i.path), message: i.message })));
}

/** Sets a run's labels can name unambiguously (two-detector sets share labels with tomo36). */
const INFERABLE: Array<[StandardSetId, number]> = [["tomo16", 2], ["tomo36", 2], ["qubit4", 1], ["qubit6", 1], ["product4", 3], ["product6", 3], ["product4", 4], ["product6", 4]];

/** The standard set whose labels are exactly these (each once), or "custom". */
export function inferSettingSetId(labels: readonly unknown[]): StandardSetId | "custom" {
  if (!labels.every((l) => typeof l === "string")) return "custom";
  const given = new Set((labels as string[]).map((l) => l.trim().toUpperCase()));
  if (given.size !== labels.length) return "custom";
  for (const [id, photons] of INFERABLE) {
    const set = standardSet(id, photons);
    if (set.labels.length === given.size && set.labels.every((l) => given.has(l))) return id;
  }
  return "custom";
}
