/**
 * The rows of the counts-entry grid: one per counted outcome, with the waveplate angles to turn
 * in each arm computed by the engine from the session's calibrations and handedness.
 */
import { standardSet, type Letter, type SetupConventions, type StandardSetId } from "@shared/physics";
// Not (yet) re-exported by the engine's index: the per-arm angle table and the port rule the model uses.
import { angleTable, transmittedLetter } from "@shared/physics/settings";
import type { LabSessionDto } from "@shared/schemas/labSessions";

export type EntrySetId = "tomo16" | "tomo36" | "pairs9" | "custom";

export const ENTRY_SETS: { id: EntrySetId; label: string; description: string }[] = [
  { id: "tomo16", label: "16 settings", description: "The 16 settings of James, Kwiat, Munro and White (2001), one detector per arm." },
  { id: "tomo36", label: "36 settings", description: "Every pair of H, V, D, A, R, L: overcomplete, one detector per arm." },
  { id: "pairs9", label: "9 bases, 2 detectors", description: "Nine basis pairs with both PBS ports counted in each arm: four outcomes per setting." },
  { id: "custom", label: "Custom", description: "Any list of settings you type, one label per row (e.g. HD)." },
];

export interface ArmSetting {
  qwpDeg: number;
  hwpDeg: number;
  /** Which PBS port counts this outcome. */
  port: "transmitted" | "reflected";
  /** How close the angles come to the wanted state (1 = exactly; below 1 with retardance errors). */
  reach: number;
}

export interface GridRow {
  label: string;
  /** Name of the waveplate setting this outcome belongs to (equal to label for one-detector sets). */
  setting: string;
  /** First outcome of its setting: the angles are shown on this row only. */
  startsSetting: boolean;
  arms: ArmSetting[];
}

export type Conventions = Pick<LabSessionDto, "handedness" | "calibration" | "analyser">;

/** Per arm, whether both PBS ports are counted: always for two-detector sets, else as the session says. */
export function bothPortsOf(setId: EntrySetId, conventions: Conventions): boolean[] {
  return conventions.analyser.arms.map((a) => setId === "pairs9" || a.bothPorts);
}

/** The engine's conventions for this session and set, the same the server reconstructs with. */
export function engineConventions(setId: EntrySetId, conventions: Conventions): SetupConventions {
  return { handedness: conventions.handedness, calibration: conventions.calibration, bothPorts: bothPortsOf(setId, conventions) };
}

/** Labels of a standard entry set, in the order the grid lists them. */
export function setLabels(id: Exclude<EntrySetId, "custom">): string[] {
  return standardSet(id as StandardSetId).labels;
}

/** Grid rows for the given labels; a label that is not 2 letters of H V D A R L gets no angles. */
export function gridRows(labels: string[], setId: EntrySetId, conventions: Conventions): GridRow[] {
  const bothPorts = bothPortsOf(setId, conventions);
  const tables = [0, 1].map((arm) => angleTable(conventions.handedness, conventions.calibration[arm]));
  const groups = setId === "pairs9" ? standardSet("pairs9").groups : null;
  return labels.map((label, i) => {
    const group = groups?.find((g) => g.outcomes.includes(label));
    const letters = label.toUpperCase().split("");
    const valid = letters.length === 2 && letters.every((l) => "HVDARL".includes(l));
    const arms = valid
      ? letters.map((l, arm) => {
          const { letter, reflected } = transmittedLetter(l as Letter, bothPorts[arm] ?? false);
          const a = tables[arm].get(letter)!;
          return { qwpDeg: a.qwpDeg, hwpDeg: a.hwpDeg, port: reflected ? ("reflected" as const) : ("transmitted" as const), reach: a.fidelity };
        })
      : [];
    const setting = group?.name ?? label;
    const previous = i > 0 ? (groups?.find((g) => g.outcomes.includes(labels[i - 1]))?.name ?? labels[i - 1]) : null;
    return { label, setting, startsSetting: previous !== setting, arms };
  });
}
