import { z } from "zod";
import { LIMITS } from "../limits";
import { STANDARD_SET_IDS, standardSet, type StandardSetId } from "../physics/settings";
import { AllowedActionsSchema } from "./labs";
import { listQuery, numberField, pageOf, PersonRefSchema, UuidSchema } from "./listing";
import { CorrectionsSchema, HeadlineSchema, ReconstructionSchema } from "./reconstructions";

export const RunIdParamsSchema = z.object({ labId: UuidSchema("Lab id"), runId: UuidSchema("Run id") });

export const RunKindSchema = z.enum(["tomography", "bell", "fringe"], "Kind is tomography, bell or fringe.");
export type RunKind = z.infer<typeof RunKindSchema>;

/** A standard set of the engine (tomo16, tomo36, pairs9, …) or "custom" (any rows). */
const SETTING_SET_IDS = ["custom", ...STANDARD_SET_IDS] as ["custom", ...StandardSetId[]];
export const SettingSetIdSchema = z.enum(SETTING_SET_IDS, `Setting set is one of: ${SETTING_SET_IDS.join(", ")}.`);
export type SettingSetId = z.infer<typeof SettingSetIdSchema>;

const angle = (what: string) => numberField(what).min(-360, `${what} is between −360° and 360°.`).max(360, `${what} is between −360° and 360°.`);

/** Waveplate angles turned in one arm and the PBS port counted (transmitted by default). */
export const ArmAnglesSchema = z.object({
  qwpDeg: angle("QWP angle"),
  hwpDeg: angle("HWP angle"),
  port: z.enum(["transmitted", "reflected"], "Port is transmitted or reflected.").optional(),
});

const LABEL_PATTERN = /^[HVDARL]{1,4}$/;

/** A setting label: one letter per photon (photon A first), each of H V D A R L. */
export const SettingLabelSchema = z
  .string()
  .trim()
  .toUpperCase()
  .regex(LABEL_PATTERN, "Setting is 1–4 letters from H, V, D, A, R, L (photon A first), e.g. HV.");

const count = (what: string) => z.number(`${what} must be a number.`).int(`${what} must be a whole number.`).min(0, `${what} cannot be negative.`).max(1e15, `${what} is implausibly large.`);

/** One counts row exactly as entered. Raw data: stored unchanged, corrected only by a new revision. */
export const CountsRowSchema = z.object({
  setting: z.union([SettingLabelSchema, z.array(ArmAnglesSchema).min(1).max(4)], "Setting is a label like HV or the waveplate angles of every arm."),
  counts: count("Counts"),
  /** Exposure, seconds. */
  seconds: numberField("Exposure").positive("Exposure must be above 0 s.").max(1e7, "Exposure is at most 10,000,000 s.").default(1),
  /** Singles of arm A's and B's detector during the exposure (counts, not rates). */
  singlesA: count("Singles A").nullable().default(null),
  singlesB: count("Singles B").nullable().default(null),
  /** Drift monitor reading (e.g. pump power), any unit. */
  monitor: numberField("Monitor").positive("Monitor reading must be above 0.").nullable().default(null),
});
export type CountsRowInput = z.input<typeof CountsRowSchema>;
export type CountsRowDto = z.infer<typeof CountsRowSchema>;

export const RowsSchema = z.array(CountsRowSchema).min(1, "Enter at least one row of counts.").max(LIMITS.runRows, `At most ${LIMITS.runRows} rows.`);

/** Conditions that vary from run to run inside one session (the x-axis of trend plots). */
export const RunConditionsSchema = z.object({
  pumpPowerMw: numberField("Pump power").min(0, "Pump power cannot be negative.").nullable().default(null),
  crystalTemperatureC: numberField("Crystal temperature").min(-273.15, "Below absolute zero.").nullable().default(null),
  compensatorTiltDeg: angle("Compensator tilt").nullable().default(null),
});

/** Whether the rows fit the chosen set: every label of a standard set exactly once. */
function checkRowsAgainstSet(settingSetId: SettingSetId, kind: RunKind, rows: CountsRowDto[], ctx: z.RefinementCtx): void {
  // No rows (or not a list) already has its own message; there is no first row to size the set by.
  if (kind !== "tomography" || settingSetId === "custom" || !Array.isArray(rows) || rows.length === 0) return;
  let set: ReturnType<typeof standardSet>;
  try {
    set = standardSet(settingSetId, rows[0].setting.length);
  } catch (e) {
    ctx.addIssue({ code: "custom", path: ["rows", 0, "setting"], message: (e as Error).message });
    return;
  }
  const wanted = new Set(set.labels);
  const seen = new Map<string, number>();
  rows.forEach((row, i) => {
    // Malformed labels already have their own message; zod runs this refinement regardless.
    if (typeof row.setting === "string" && !LABEL_PATTERN.test(row.setting)) return;
    if (typeof row.setting !== "string") {
      ctx.addIssue({ code: "custom", path: ["rows", i, "setting"], message: `The ${settingSetId} set is entered by labels; use the "custom" set for rows given as angles.` });
    } else if (!wanted.has(row.setting)) {
      ctx.addIssue({ code: "custom", path: ["rows", i, "setting"], message: `${row.setting} is not a setting of the ${settingSetId} set.` });
    } else if (seen.has(row.setting)) {
      ctx.addIssue({ code: "custom", path: ["rows", i, "setting"], message: `${row.setting} appears twice (rows ${seen.get(row.setting)! + 1} and ${i + 1}).` });
    } else seen.set(row.setting, i);
  });
  const missing = set.labels.filter((l) => !seen.has(l));
  const malformed = rows.some((r) => typeof r.setting === "string" && !LABEL_PATTERN.test(r.setting));
  if (!malformed && missing.length && missing.length < set.labels.length) {
    ctx.addIssue({ code: "custom", path: ["rows"], message: `The ${settingSetId} set needs ${set.labels.length} rows; missing: ${missing.slice(0, 8).join(", ")}${missing.length > 8 ? ", …" : ""}.` });
  }
}

/** Files and scripts can carry "\u0000", which PostgreSQL cannot store in text. */
const noNul = (s: string) => !s.includes("\u0000");
const NUL_MESSAGE = "Holds a NUL character (\\u0000), which cannot be stored; remove it.";

const RunFieldsSchema = z.object({
  kind: RunKindSchema.default("tomography"),
  settingSetId: SettingSetIdSchema,
  name: z.string().trim().min(1, "Give the run a name, e.g. “5 mW”.").max(LIMITS.nameLength, `At most ${LIMITS.nameLength} characters.`).refine(noNul, NUL_MESSAGE),
  notes: z.string().max(LIMITS.notesLength, `Notes are at most ${LIMITS.notesLength} characters.`).refine(noNul, NUL_MESSAGE).default(""),
  conditions: RunConditionsSchema.default({ pumpPowerMw: null, crystalTemperatureC: null, compensatorTiltDeg: null }),
  rows: RowsSchema,
});

/** Options for the reconstructions computed when a run (or a revision) is saved. */
export const InitialReconstructionSchema = z.object({
  corrections: CorrectionsSchema.default({ accidentals: false, windowNs: null, efficiencies: null, drift: "none" }),
  monteCarloSamples: z.number().int("Samples must be a whole number.").min(0, "Samples cannot be negative.").max(LIMITS.monteCarloMax, `At most ${LIMITS.monteCarloMax} samples.`).refine((n) => n !== 1, "Use 0 (no uncertainties) or at least 2 samples.").default(LIMITS.monteCarloDefault),
});

export const CreateRunSchema = RunFieldsSchema.extend({
  reconstruction: InitialReconstructionSchema.default({ corrections: { accidentals: false, windowNs: null, efficiencies: null, drift: "none" }, monteCarloSamples: LIMITS.monteCarloDefault }),
}).superRefine((run, ctx) => checkRowsAgainstSet(run.settingSetId, run.kind, run.rows, ctx));
export type CreateRun = z.infer<typeof CreateRunSchema>;

/** Only descriptive fields can be edited in place; counts change through a revision. */
export const UpdateRunSchema = z
  .object({ name: RunFieldsSchema.shape.name, notes: z.string().max(LIMITS.notesLength), conditions: RunConditionsSchema })
  .partial()
  .refine((b) => Object.keys(b).length > 0, "Change at least one field.");
export type UpdateRun = z.infer<typeof UpdateRunSchema>;

/** A correction of the counts: the full corrected table plus why. The old revision is kept. */
export const CreateRevisionSchema = z.object({
  reason: z.string().trim().min(1, "Say why the counts are corrected.").max(LIMITS.shortTextLength),
  rows: RowsSchema,
  reconstruction: InitialReconstructionSchema.optional(),
});
export type CreateRevision = z.infer<typeof CreateRevisionSchema>;

/**
 * Fields sent with a CSV upload (multipart form fields beside `file`, our counts CSV; see README
 * "Run file format"). Without settingSetId a tomography set is recognised from the labels
 * (tomo16, tomo36, else custom; Bell tests and fringe scans are custom); without name the file
 * name is used.
 */
export const UploadRunFieldsSchema = z.object({
  /** What the file holds: tomography (default), a Bell test or a fringe scan. */
  kind: RunKindSchema.default("tomography"),
  name: RunFieldsSchema.shape.name.optional(),
  notes: z.string().max(LIMITS.notesLength, `Notes are at most ${LIMITS.notesLength} characters.`).optional(),
  settingSetId: SettingSetIdSchema.optional(),
  pumpPowerMw: z.coerce.number("Pump power must be a number.").min(0, "Pump power cannot be negative.").optional(),
});
export type UploadRunFields = z.input<typeof UploadRunFieldsSchema>;

export const RunListQuerySchema = listQuery(["createdAt", "name", "kind", "fidelity", "concurrence", "purity", "pumpPowerMw"], "createdAt").extend({
  sessionId: UuidSchema("Session").optional(),
  sourceId: UuidSchema("Source").optional(),
  kind: RunKindSchema.optional(),
});
export type RunListQuery = z.infer<typeof RunListQuerySchema>;

export const RowChangeSchema = z.object({ row: z.number().int(), field: z.string(), from: z.unknown(), to: z.unknown() });

export const RunRevisionSchema = z.object({
  id: z.string().uuid(),
  number: z.number().int(),
  reason: z.string(),
  /** What differs from the previous revision ("row" is 0-based; added/removed rows have field "row"). */
  changes: z.array(RowChangeSchema),
  rows: z.array(CountsRowSchema),
  createdBy: PersonRefSchema,
  createdAt: z.string(),
});
export type RunRevisionDto = z.infer<typeof RunRevisionSchema>;

export const AttachmentSchema = z.object({
  id: z.string().uuid(),
  runId: z.string().uuid(),
  fileName: z.string(),
  contentType: z.string(),
  sizeBytes: z.number().int(),
  sha256: z.string(),
  /** GET this for the bytes exactly as uploaded. */
  downloadPath: z.string(),
  createdBy: PersonRefSchema,
  createdAt: z.string(),
});
export type AttachmentDto = z.infer<typeof AttachmentSchema>;

export const RunSchema = z.object({
  id: z.string().uuid(),
  labId: z.string().uuid(),
  session: z.object({ id: z.string().uuid(), title: z.string(), date: z.string() }),
  source: z.object({ id: z.string().uuid(), name: z.string(), targetState: z.string() }),
  kind: RunKindSchema,
  settingSetId: SettingSetIdSchema,
  name: z.string(),
  notes: z.string(),
  conditions: RunConditionsSchema,
  rowCount: z.number().int(),
  totalCounts: z.number(),
  revisionNumber: z.number().int(),
  /** Key figures of the newest maximum-likelihood reconstruction of the current counts. */
  headline: HeadlineSchema.nullable(),
  createdBy: PersonRefSchema,
  createdAt: z.string(),
  updatedAt: z.string(),
  can: AllowedActionsSchema,
});
export type RunDto = z.infer<typeof RunSchema>;

export const RunDetailSchema = RunSchema.extend({
  /** Rows of the current revision. */
  rows: z.array(CountsRowSchema),
  revisions: z.array(RunRevisionSchema),
  /** Newest first; each names the revision it used. */
  reconstructions: z.array(ReconstructionSchema),
  attachments: z.array(AttachmentSchema),
});
export type RunDetailDto = z.infer<typeof RunDetailSchema>;

export const RunPageSchema = pageOf(RunSchema);
export type RunPage = z.infer<typeof RunPageSchema>;
