/**
 * Rhomb's sweep CSV: many runs in one file, one run per line — what an acquisition script writes
 * while it steps the pump power or a temperature.
 *
 *   # comment lines start with '#'
 *   run,pump_mw,seconds,HH,HV,VV,VH,…,HH_singles_a,HH_singles_b,…
 *   1 mW,1,1,12,2034,15,1998,…
 *
 * - One column per setting, named by its label (1–4 letters from H V D A R L, photon A first),
 *   holding that setting's coincidence counts. Optional per setting: `<label>_singles_a`,
 *   `<label>_singles_b` (both or neither) and `<label>_monitor`.
 * - Optional per run: `run` (its name; default "<file> row <n>"), `set` (a standard set id;
 *   default the set whose labels the columns name exactly, else "custom"), `seconds` (exposure
 *   of every setting, default 1), `pump_mw`, `crystal_c`, `tilt_deg` (conditions) and `notes`.
 * - Column names are case-insensitive; unknown or repeated columns are refused, not ignored.
 * - Delimiter: comma, or semicolon/tab as some spreadsheets write them.
 * Errors name the line in the file (as an editor shows it) and the column:
 *   row 7, column "HV": "12x" is not a whole number ≥ 0
 */
import Papa from "papaparse";
import { CsvLineNumbers } from "./csvLineNumbers";
import { LIMITS } from "../limits";
import type { CreateRun } from "../schemas/runs";
import type { CountsRow } from "../physics/types";
import { inferSettingSetId, RunFileError, validateRun, type RunFileOptions } from "./runJson";

const RUN_FIELDS = { run: "name", set: "settingSetId", seconds: "seconds", pump_mw: "pumpPowerMw", crystal_c: "crystalTemperatureC", tilt_deg: "compensatorTiltDeg", notes: "notes" } as const;
type RunColumn = keyof typeof RUN_FIELDS;
const PER_SETTING = ["singles_a", "singles_b", "monitor"] as const;
type SettingColumn = (typeof PER_SETTING)[number];
const ROW_KEY: Record<SettingColumn, "singlesA" | "singlesB" | "monitor"> = { singles_a: "singlesA", singles_b: "singlesB", monitor: "monitor" };
const LABEL = /^[HVDARL]{1,4}$/i;
const SETTING_COLUMN = /^([HVDARL]{1,4})_(singles_a|singles_b|monitor)$/i;

interface Record_ {
  fields: string[];
  line: number;
}

export interface SweepHeader {
  /** Column names in lower case (for lookups), and as the file wrote them. */
  names: string[];
  written: string[];
  labels: string[];
  line: number;
}

export interface SweepFile {
  header: SweepHeader;
  /** Data lines, each with its line number in the file. */
  records: Record_[];
}

/** True when the first non-comment line names settings as columns (a sweep), not `basis` (one run). */
export function isSweepCsv(text: string): boolean {
  const first = readRecords(text, 1)[0];
  if (!first) return false;
  const names = first.fields.map((f) => f.trim().toLowerCase());
  return !names.includes("basis") && names.some((n) => LABEL.test(n));
}

/** Reads and checks the header and splits the lines; header problems refuse the whole file. */
export function readSweepCsv(text: string): SweepFile {
  const records = readRecords(text);
  if (records.length === 0) throw fileError(1, null, "the file is empty (expected a header naming the settings, e.g. run,HH,HV,…)");
  const header = readHeader(records[0]);
  const data = records.slice(1);
  if (data.length === 0) throw fileError(header.line, null, "there are no runs after the header");
  if (data.length > LIMITS.sweepRuns) throw fileError(data[LIMITS.sweepRuns].line, null, `a sweep file holds at most ${LIMITS.sweepRuns} runs; this one has ${data.length} — split it`);
  return { header, records: data };
}

/** One line as a two-line sweep CSV (header + that run): what a batch keeps of each run. */
export function sweepLineAsCsv(file: SweepFile, record: Record_): string {
  return `${Papa.unparse([file.header.written, record.fields], { newline: "\n" })}\n`;
}

export interface SweepRun {
  name: string;
  pumpPowerMw?: number | null;
  crystalTemperatureC?: number | null;
  compensatorTiltDeg?: number | null;
  /** Exposure of every setting, seconds (written only when not 1). */
  seconds?: number;
  /** Label rows in the same settings order for every run. */
  rows: CountsRow[];
}

/** Writes runs as a sweep CSV: one line per run, one column per setting (+ singles when given). */
export function writeSweepCsv(runs: readonly SweepRun[], comments: readonly string[] = []): string {
  const labels = runs[0].rows.map((r) => {
    if (typeof r.setting !== "string") throw new Error("only label settings can be written to a sweep CSV");
    return r.setting;
  });
  const all = runs.flatMap((r) => r.rows);
  const singles = all.some((r) => r.singlesA !== undefined || r.singlesB !== undefined);
  const optional = (["pumpPowerMw", "crystalTemperatureC", "compensatorTiltDeg"] as const).filter((k) => runs.some((r) => r[k] !== undefined && r[k] !== null));
  const seconds = runs.some((r) => (r.seconds ?? 1) !== 1);
  const header = ["run", ...(seconds ? ["seconds"] : []), ...optional.map((k) => COLUMN_OF[k]), ...labels, ...(singles ? labels.flatMap((l) => [`${l}_singles_a`, `${l}_singles_b`]) : [])];
  const lines = runs.map((run) => {
    const at = new Map(run.rows.map((r) => [r.setting as string, r]));
    const row = (l: string) => at.get(l) ?? (() => { throw new Error(`run "${run.name}" has no ${l} row`); })();
    return [
      run.name,
      ...(seconds ? [run.seconds ?? 1] : []),
      ...optional.map((k) => run[k] ?? ""),
      ...labels.map((l) => row(l).counts),
      ...(singles ? labels.flatMap((l) => [row(l).singlesA ?? "", row(l).singlesB ?? ""]) : []),
    ];
  });
  const body = Papa.unparse([header, ...lines], { newline: "\n" });
  return `${comments.map((c) => `# ${c}\n`).join("")}${body}\n`;
}

const COLUMN_OF = { pumpPowerMw: "pump_mw", crystalTemperatureC: "crystal_c", compensatorTiltDeg: "tilt_deg" } as const;

/** Every run of a sweep file; each bad line is its own error, the others still parse. */
export function parseSweepCsv(text: string, options: RunFileOptions & { firstLine?: number } = {}): Array<{ line: number; run: CreateRun } | { line: number; error: RunFileError }> {
  const file = readSweepCsv(text);
  const shift = options.firstLine === undefined ? 0 : options.firstLine - file.records[0].line;
  return file.records.map((record) => {
    const line = record.line + shift;
    try {
      return { line, run: sweepRun(file.header, { ...record, line }, options) };
    } catch (e) {
      if (e instanceof RunFileError) return { line, error: e };
      throw e;
    }
  });
}

function sweepRun(header: SweepHeader, record: Record_, options: RunFileOptions): CreateRun {
  const { names, labels } = header;
  if (record.fields.length > names.length) throw fileError(record.line, null, `${record.fields.length} values but the header has ${names.length} columns`);
  const cell = (name: string) => record.fields[names.indexOf(name)]?.trim() ?? "";
  const has = (name: string) => names.includes(name);
  const number = (name: string, whole: boolean): number | null => {
    const raw = cell(name);
    if (raw === "") return null;
    const ok = whole ? /^\d+$/.test(raw) : /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(raw);
    if (!ok) throw fileError(record.line, shownName(name), `${JSON.stringify(raw)} is not ${whole ? "a whole number ≥ 0" : "a number"}`);
    return Number(raw);
  };
  const seconds = number("seconds", false) ?? 1;
  const rows = labels.map((label) => {
    const key = label.toLowerCase();
    const counts = number(key, true);
    if (counts === null) throw fileError(record.line, label, "empty (every setting needs its counts)");
    const row: Record<string, unknown> = { setting: label, counts, seconds };
    for (const c of PER_SETTING) if (has(`${key}_${c}`)) row[ROW_KEY[c]] = number(`${key}_${c}`, c !== "monitor");
    return row;
  });
  const lineName = options.fallbackName ? `${options.fallbackName} row ${record.line}` : `row ${record.line}`;
  const input = {
    kind: "tomography",
    name: cell("run") || lineName,
    settingSetId: cell("set") || inferSettingSetId(labels),
    notes: cell("notes"),
    conditions: { pumpPowerMw: number("pump_mw", false), crystalTemperatureC: number("crystal_c", false), compensatorTiltDeg: number("tilt_deg", false) },
    rows,
    ...(options.reconstruction && { reconstruction: options.reconstruction }),
  };
  return validateRun(input, (path) => ({ row: record.line, column: sweepColumnOf(path, labels) }));
}

/** Where a zod path into the run sits in the sweep layout. */
export function sweepColumnOf(path: PropertyKey[], labels: readonly string[]): string | null {
  if (path[0] === "rows" && typeof path[1] === "number") {
    const label = labels[path[1]];
    const key = path[2];
    if (key === "seconds") return "seconds";
    const suffix = (Object.keys(ROW_KEY) as SettingColumn[]).find((c) => ROW_KEY[c] === key);
    return suffix ? `${label}_${suffix}` : label;
  }
  if (path[0] === "conditions") {
    const entry = Object.entries(RUN_FIELDS).find(([, field]) => field === path[1]);
    return entry?.[0] ?? "conditions";
  }
  const entry = Object.entries(RUN_FIELDS).find(([, field]) => field === path[0]);
  return entry?.[0] ?? (path.length ? String(path[0]) : null);
}

function readHeader(record: Record_): SweepHeader {
  const names = record.fields.map((f) => f.trim().toLowerCase());
  const labels: string[] = [];
  names.forEach((name, i) => {
    if (names.indexOf(name) !== i) throw fileError(record.line, record.fields[i].trim(), "appears twice in the header");
    if (LABEL.test(name)) labels.push(name.toUpperCase());
    else if (!(name in RUN_FIELDS) && !SETTING_COLUMN.test(name)) {
      throw fileError(record.line, record.fields[i].trim(), `unknown column (allowed: setting labels such as HV, <label>_singles_a, <label>_singles_b, <label>_monitor, ${Object.keys(RUN_FIELDS).join(", ")})`);
    }
  });
  if (labels.length === 0) throw fileError(record.line, null, "no setting columns (name one column per setting, e.g. HH,HV,VV,VH,…)");
  const photons = labels[0].length;
  const odd = labels.find((l) => l.length !== photons);
  if (odd) throw fileError(record.line, odd, `names ${odd.length} photon(s) but column ${labels[0]} names ${photons}`);
  for (const name of names) {
    const m = SETTING_COLUMN.exec(name);
    if (!m) continue;
    const [, label, kind] = m;
    if (!labels.includes(label.toUpperCase())) throw fileError(record.line, shownName(name), `there is no column ${label.toUpperCase()} for these ${kind.replace("_", " ")}`);
    const partner = kind === "singles_a" ? "singles_b" : kind === "singles_b" ? "singles_a" : null;
    if (partner && !names.includes(`${label}_${partner}`)) throw fileError(record.line, shownName(`${label}_${partner}`), `missing (${label}_singles_a and ${label}_singles_b come together)`);
  }
  return { names, written: record.fields.map((f) => f.trim()), labels, line: record.line };
}

/** A column as people write it: labels in capitals ("HV", "HV_singles_a"), the rest in lower case. */
function shownName(name: string): string {
  const m = /^([hvdarl]{1,4})(_.*)?$/.exec(name);
  return m ? m[1].toUpperCase() + (m[2] ?? "") : name;
}

function fileError(row: number, column: string | null, message: string): RunFileError {
  return new RunFileError([{ row, column, message }]);
}

/** Records with their 1-based file line; stops after `limit` records when given. */
function readRecords(input: string, limit = Infinity): Record_[] {
  const text = input.replace(/^\uFEFF/, "");
  const lineNumbers = new CsvLineNumbers(text);
  const records: Record_[] = [];
  let failure: RunFileError | null = null;
  Papa.parse<string[]>(text, {
    comments: "#",
    skipEmptyLines: "greedy",
    delimitersToGuess: [",", ";", "\t"],
    step: (result, parser) => {
      const line = lineNumbers.lineBefore(result.meta.cursor);
      if (result.errors.length) {
        failure = fileError(line, null, result.errors[0].message);
        parser.abort();
        return;
      }
      records.push({ fields: result.data, line });
      if (records.length >= limit) parser.abort();
    },
  });
  if (failure) throw failure;
  return records;
}

