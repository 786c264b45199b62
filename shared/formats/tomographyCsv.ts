/**
 * Rhomb's tomography counts CSV.
 *
 *   # comment lines start with '#'; anywhere in the file
 *   basis,counts,seconds,singles_a,singles_b,monitor
 *   HH,1234,1,40000,38000
 *
 * - Header (first non-comment line) with at least `basis,counts`; optional `seconds` (exposure,
 *   default 1), `singles_a` and `singles_b` (detector singles during the exposure; both or
 *   neither) and `monitor` (a drift-monitor reading). Column names are case-insensitive.
 * - Unknown columns are rejected, not ignored: a misspelt "singels_a" must not silently turn
 *   accidental subtraction off. So is a column named twice.
 * - basis: 1–4 letters from H V D A R L, photon A first, the same length in every row.
 * - counts and singles: whole numbers 0 … 10^15 written as digits; seconds > 0 and ≤ 10^7;
 *   monitor > 0. A repeated setting is rejected (usually a copy-paste slip) unless the caller
 *   allows repeats.
 * - Settings as waveplate angles instead of a label: leave `basis` out (or empty on the row) and
 *   give `arm_a_qwp_deg,arm_a_hwp_deg[,arm_a_port]` and the same for arm b (c, d for more
 *   photons): the angles turned in each arm, degrees, and the PBS port counted (`transmitted`,
 *   the default, or `reflected`). This is how Bell tests and fringe scans at arbitrary polariser
 *   angles are written, and how the counts export writes rows that were entered as angles.
 * - Delimiter: comma, or semicolon/tab as spreadsheets in some locales write them.
 * Errors name the row (the line number in the file, as an editor shows it) and the column:
 *   row 7, column "counts": "12x" is not a whole number ≥ 0
 */
import Papa from "papaparse";
import { CsvLineNumbers } from "./csvLineNumbers";
import type { ArmAngles, CountsRow, Port } from "../physics/types";

/** Same limits as the run schema (shared/schemas/runs.ts). */
export const CSV_COUNTS_MAX = 1e15;
export const CSV_SECONDS_MAX = 1e7;
export const CSV_ANGLE_ARMS = ["a", "b", "c", "d"] as const;
const ANGLE_COLUMNS = CSV_ANGLE_ARMS.flatMap((a) => [`arm_${a}_qwp_deg`, `arm_${a}_hwp_deg`, `arm_${a}_port`] as const);
export const CSV_COLUMNS = ["basis", "counts", "seconds", "singles_a", "singles_b", "monitor", ...ANGLE_COLUMNS] as const;
type Column = (typeof CSV_COLUMNS)[number];
const ANGLE_LIMIT_DEG = 720;

export interface TomographyCsvOptions {
  /** Every row must carry singles (for accidental subtraction). */
  requireSingles?: boolean;
  /** Accept the same setting on several rows (repeated measurements). */
  allowRepeats?: boolean;
}

export interface ParsedTomographyCsv {
  rows: CountsRow[];
  /** File line number of each row. */
  lines: number[];
  photons: number;
  columns: Column[];
  /** Text of the comment lines, without the '#'. */
  comments: string[];
}

export class TomographyCsvError extends Error {
  constructor(readonly row: number, readonly column: string | null, detail: string) {
    super(column === null ? `row ${row}: ${detail}` : `row ${row}, column "${column}": ${detail}`);
    this.name = "TomographyCsvError";
  }
}

export function parseTomographyCsv(input: string, options: TomographyCsvOptions = {}): ParsedTomographyCsv {
  const text = input.replace(/^\uFEFF/, "");
  const lineNumbers = new CsvLineNumbers(text);
  const records: { fields: string[]; line: number }[] = [];
  let parseError: TomographyCsvError | null = null;
  Papa.parse<string[]>(text, {
    comments: "#",
    skipEmptyLines: "greedy",
    delimitersToGuess: [",", ";", "\t"],
    step: (result, parser) => {
      const line = lineNumbers.lineBefore(result.meta.cursor);
      if (result.errors.length) {
        // An unclosed quote swallows the rest of the file: name the line where the quote opened.
        const [first] = result.errors;
        const at = first.type === "Quotes" && typeof first.index === "number" ? lineNumbers.lineBefore(first.index + 1) : line;
        parseError = new TomographyCsvError(at, null, first.message);
        parser.abort();
        return;
      }
      records.push({ fields: result.data, line });
    },
  });
  if (parseError) throw parseError;
  const comments = text.split(/\r?\n/).filter((l) => l.trimStart().startsWith("#")).map((l) => l.trimStart().slice(1).trim());
  if (records.length === 0) {
    throw new TomographyCsvError(1, null, "the file is empty (expected a header with at least basis,counts)");
  }
  const header = readHeader(records[0], options);
  const anglesArms = angleArmsOf(header, records[0].line);
  if (records.length === 1) throw new TomographyCsvError(records[0].line, null, "there are no data rows after the header");

  const rows: CountsRow[] = [];
  const lines: number[] = [];
  const seen = new Map<string, number>();
  let photons = 0;
  for (const { fields, line } of records.slice(1)) {
    if (fields.length > header.length) {
      throw new TomographyCsvError(line, null, `${fields.length} values but the header has ${header.length} columns`);
    }
    const value = (c: Column) => fields[header.indexOf(c)]?.trim() ?? "";
    const basis = value("basis").toUpperCase();
    const setting = basis === "" && anglesArms > 0 ? angleSetting(value, anglesArms, line) : labelSetting(basis, value("basis"), line);
    const label = typeof setting === "string";
    const what = label ? `"${setting}"` : "these waveplate angles";
    if (photons === 0) photons = setting.length;
    else if (setting.length !== photons) {
      throw new TomographyCsvError(line, label ? "basis" : null, `${what} name${label ? "s" : ""} ${setting.length} photon(s) but row ${lines[0]} names ${photons}`);
    }
    const key = label ? setting : JSON.stringify(setting);
    if (seen.has(key) && !options.allowRepeats) {
      throw new TomographyCsvError(line, label ? "basis" : null, `${what} repeat${label ? "s" : ""} row ${seen.get(key)}`);
    }
    seen.set(key, line);
    const row: CountsRow = { setting, counts: wholeNumber(value("counts"), line, "counts", true)! };
    if (header.includes("seconds")) row.seconds = positiveNumber(value("seconds"), line, "seconds", CSV_SECONDS_MAX, true);
    if (header.includes("singles_a")) {
      const a = wholeNumber(value("singles_a"), line, "singles_a", !!options.requireSingles);
      const b = wholeNumber(value("singles_b"), line, "singles_b", !!options.requireSingles);
      if ((a === undefined) !== (b === undefined)) {
        throw new TomographyCsvError(line, a === undefined ? "singles_a" : "singles_b", "empty, but the other singles value is given (give both or neither)");
      }
      if (a !== undefined) row.singlesA = a;
      if (b !== undefined) row.singlesB = b;
    }
    if (header.includes("monitor")) {
      const m = positiveNumber(value("monitor"), line, "monitor", Infinity, false);
      if (m !== undefined) row.monitor = m;
    }
    rows.push(row);
    lines.push(line);
  }
  return { rows, lines, photons, columns: header, comments };
}

/** A column the user probably meant: singular for plural, or other separators ("count", "singles-a", "singlesA"). */
function nearColumn(name: string): string | undefined {
  const squash = (x: string) => x.replace(/[\s_-]/g, "");
  return (CSV_COLUMNS as readonly string[]).find((c) => c === `${name}s` || `${c}s` === name || squash(c) === squash(name));
}

function readHeader(record: { fields: string[]; line: number }, options: TomographyCsvOptions): Column[] {
  const names = record.fields.map((f) => f.trim().toLowerCase());
  names.forEach((n, i) => {
    if (!(CSV_COLUMNS as readonly string[]).includes(n)) {
      const near = nearColumn(n);
      const hint = near ? ` — did you mean "${near}"?` : /^\d/.test(n) || /^[hvdarl]{1,4}$/.test(n) ? " — is the header line missing?" : "";
      throw new TomographyCsvError(record.line, record.fields[i].trim(), `unknown column (allowed: basis, counts, seconds, singles_a, singles_b, monitor, arm_a_qwp_deg, arm_a_hwp_deg, arm_a_port, … for arms a–d)${hint}`);
    }
    if (names.indexOf(n) !== i) throw new TomographyCsvError(record.line, n, "appears twice in the header");
  });
  if (!names.includes("counts")) throw new TomographyCsvError(record.line, "counts", "missing from the header (it needs at least basis,counts)");
  if (!names.includes("basis") && !names.includes("arm_a_qwp_deg")) {
    throw new TomographyCsvError(record.line, "basis", "missing from the header (it needs basis,counts, or waveplate angles arm_a_qwp_deg,arm_a_hwp_deg,… and counts)");
  }
  const hasA = names.includes("singles_a");
  const hasB = names.includes("singles_b");
  if (hasA !== hasB) throw new TomographyCsvError(record.line, hasA ? "singles_b" : "singles_a", "missing from the header (singles_a and singles_b come together)");
  if (options.requireSingles && !hasA) {
    throw new TomographyCsvError(record.line, "singles_a", "missing from the header; accidental subtraction needs singles_a and singles_b");
  }
  return names as Column[];
}

/** How many arms the header gives angles for (arms a, b, … in order, each with qwp and hwp). */
function angleArmsOf(header: Column[], line: number): number {
  let arms = 0;
  for (const arm of CSV_ANGLE_ARMS) {
    const qwp = header.includes(`arm_${arm}_qwp_deg`);
    const hwp = header.includes(`arm_${arm}_hwp_deg`);
    const port = header.includes(`arm_${arm}_port`);
    if (!qwp && !hwp && !port) break;
    if (!qwp || !hwp) throw new TomographyCsvError(line, qwp ? `arm_${arm}_hwp_deg` : `arm_${arm}_qwp_deg`, `missing from the header (arm ${arm.toUpperCase()} needs both waveplate angles)`);
    arms++;
  }
  const extra = header.find((c) => c.startsWith("arm_") && !CSV_ANGLE_ARMS.slice(0, arms).some((a) => c.startsWith(`arm_${a}_`)));
  if (extra) throw new TomographyCsvError(line, extra, "arms must be given in order a, b, c, d without gaps");
  return arms;
}

function labelSetting(basis: string, raw: string, line: number): string {
  if (!/^[HVDARL]{1,4}$/.test(basis)) {
    throw new TomographyCsvError(line, "basis", `${quote(raw)} is not 1–4 letters from H, V, D, A, R, L (photon A first)`);
  }
  return basis;
}

function angleSetting(value: (c: Column) => string, arms: number, line: number): ArmAngles[] {
  return CSV_ANGLE_ARMS.slice(0, arms).map((arm) => {
    const angle = (c: Column) => {
      const raw = value(c);
      const n = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(raw) ? Number(raw) : NaN;
      if (raw === "") throw new TomographyCsvError(line, c, "empty (give the angle in degrees, or a basis label in the basis column)");
      if (!Number.isFinite(n) || Math.abs(n) > ANGLE_LIMIT_DEG) throw new TomographyCsvError(line, c, `${quote(raw)} is not an angle in degrees between −${ANGLE_LIMIT_DEG} and ${ANGLE_LIMIT_DEG}`);
      return n;
    };
    const portRaw = value(`arm_${arm}_port` as Column).toLowerCase();
    if (portRaw !== "" && portRaw !== "transmitted" && portRaw !== "reflected") {
      throw new TomographyCsvError(line, `arm_${arm}_port`, `${quote(portRaw)} is not a PBS port (transmitted or reflected)`);
    }
    const port: Port = portRaw === "reflected" ? "reflected" : "transmitted";
    return { qwpDeg: angle(`arm_${arm}_qwp_deg` as Column), hwpDeg: angle(`arm_${arm}_hwp_deg` as Column), port };
  });
}

function wholeNumber(raw: string, line: number, column: Column, required: boolean): number | undefined {
  if (raw === "") {
    if (required) throw new TomographyCsvError(line, column, "empty (a whole number ≥ 0 is required)");
    return undefined;
  }
  if (!/^\d+$/.test(raw)) throw new TomographyCsvError(line, column, `${quote(raw)} is not a whole number ≥ 0`);
  const n = Number(raw);
  if (n > CSV_COUNTS_MAX) throw new TomographyCsvError(line, column, `${quote(raw)} is larger than the limit of 10^15`);
  return n;
}

function positiveNumber(raw: string, line: number, column: Column, max: number, defaultOne: boolean): number | undefined {
  if (raw === "") return defaultOne ? 1 : undefined;
  const n = /^(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(raw) ? Number(raw) : NaN;
  if (!(n > 0) || !Number.isFinite(n)) throw new TomographyCsvError(line, column, `${quote(raw)} is not a number > 0`);
  if (n > max) throw new TomographyCsvError(line, column, `${quote(raw)} is larger than the limit of ${max.toExponential(0).replace("e+", "e")}`);
  return n;
}

function quote(raw: string): string {
  return JSON.stringify(raw.length > 40 ? `${raw.slice(0, 40)}…` : raw);
}


/**
 * Writes rows with label settings in the same format (the inverse of parseTomographyCsv).
 * Columns that no row uses are left out; comment lines come first.
 */
export function writeTomographyCsv(rows: readonly CountsRow[], comments: readonly string[] = []): string {
  const has = (pick: (r: CountsRow) => unknown) => rows.some((r) => pick(r) !== undefined);
  const columns: [Column, (r: CountsRow) => unknown][] = [
    ["basis", (r) => r.setting],
    ["counts", (r) => r.counts],
  ];
  if (has((r) => r.seconds)) columns.push(["seconds", (r) => r.seconds ?? 1]);
  if (has((r) => r.singlesA ?? r.singlesB)) columns.push(["singles_a", (r) => r.singlesA], ["singles_b", (r) => r.singlesB]);
  if (has((r) => r.monitor)) columns.push(["monitor", (r) => r.monitor]);
  const lines = comments.map((c) => `# ${c}`);
  lines.push(columns.map(([name]) => name).join(","));
  for (const r of rows) {
    if (typeof r.setting !== "string") throw new Error("only label settings can be written to the counts CSV");
    lines.push(columns.map(([, pick]) => String(pick(r) ?? "")).join(","));
  }
  return `${lines.join("\n")}\n`;
}
