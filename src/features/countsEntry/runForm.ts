/**
 * The new-run form's values and how they become the API body. Cells hold what was typed,
 * parsed by `parseCell` (numbers where they read as numbers, text otherwise) so that the
 * shared zod schema names every unreadable cell.
 */
import type { Resolver } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { CreateRunSchema, type CreateRun, type SettingSetId } from "@shared/schemas/runs";
import { setLabels, type EntrySetId } from "./gridRows";

export type CellValue = number | string | undefined | null;

export interface RunFormRow {
  setting: string;
  counts?: CellValue;
  seconds?: CellValue;
  singlesA?: CellValue;
  singlesB?: CellValue;
}

export interface RunFormValues {
  kind: "tomography";
  settingSetId: SettingSetId;
  name: string;
  notes: string;
  conditions: { pumpPowerMw: CellValue; crystalTemperatureC: CellValue; compensatorTiltDeg: CellValue };
  rows: RunFormRow[];
  reconstruction: { corrections: { accidentals: boolean }; monteCarloSamples: number };
}

/** Editable cells of a row, left to right. */
export type CellColumn = "counts" | "seconds" | "singlesA" | "singlesB";

export const runFormResolver = zodResolver(CreateRunSchema) as unknown as Resolver<RunFormValues, unknown, CreateRun>;

export function emptyRows(setId: EntrySetId): RunFormRow[] {
  return setId === "custom" ? [{ setting: "" }] : setLabels(setId).map((setting) => ({ setting }));
}

export function defaultRunForm(setId: EntrySetId = "tomo16"): RunFormValues {
  return {
    kind: "tomography",
    settingSetId: setId,
    name: "",
    notes: "",
    conditions: { pumpPowerMw: null, crystalTemperatureC: null, compensatorTiltDeg: null },
    rows: emptyRows(setId),
    reconstruction: { corrections: { accidentals: false }, monteCarloSamples: 200 },
  };
}

/**
 * Rows of another set, carrying over every value whose label exists in both; `lost` lists the
 * labels whose counts would be dropped (the caller asks before dropping them).
 */
export function switchRows(current: RunFormRow[], to: EntrySetId): { rows: RunFormRow[]; lost: string[] } {
  if (to === "custom") return { rows: current.map((r) => ({ ...r })), lost: [] };
  const byLabel = new Map(current.map((r) => [r.setting.toUpperCase(), r]));
  const labels = setLabels(to);
  const rows = labels.map((setting) => ({ ...byLabel.get(setting), setting }));
  const kept = new Set(labels);
  const lost = current.filter((r) => !kept.has(r.setting.toUpperCase()) && hasValue(r.counts)).map((r) => r.setting || "(unnamed)");
  return { rows, lost };
}

export function hasValue(v: CellValue): boolean {
  return v !== undefined && v !== null && v !== "";
}
