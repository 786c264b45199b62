import { z } from "zod";
import { LIMITS } from "../limits";
import { AllowedActionsSchema } from "./labs";
import { listQuery, numberField, pageOf, PersonRefSchema, UuidSchema } from "./listing";

/**
 * A lab session: one day (or series) of measurements on one setup. In code always
 * `LabSession`, never "Session", which is the sign-in session.
 */
export const LabSessionIdParamsSchema = z.object({ labId: UuidSchema("Lab id"), sessionId: UuidSchema("Session id") });

export const HandednessSchema = z.enum(["R=H+iV", "R=H-iV"], "Handedness is R=H+iV or R=H-iV.");

/** Deviation of one plate from nominal: fast-axis offset and retardance error, degrees. */
export const PlateCalibrationSchema = z.object({
  fastAxisOffsetDeg: numberField("Fast-axis offset").min(-90, "Fast-axis offset is between −90° and 90°.").max(90, "Fast-axis offset is between −90° and 90°.").default(0),
  retardanceErrorDeg: numberField("Retardance error").min(-90, "Retardance error is between −90° and 90°.").max(90, "Retardance error is between −90° and 90°.").default(0),
});
export const ArmCalibrationSchema = z.object({ qwp: PlateCalibrationSchema.default({ fastAxisOffsetDeg: 0, retardanceErrorDeg: 0 }), hwp: PlateCalibrationSchema.default({ fastAxisOffsetDeg: 0, retardanceErrorDeg: 0 }) });
const IDEAL_ARM = { qwp: { fastAxisOffsetDeg: 0, retardanceErrorDeg: 0 }, hwp: { fastAxisOffsetDeg: 0, retardanceErrorDeg: 0 } };

/** Analysers of the two arms (photon A first): QWP → HWP → PBS; both PBS ports counted or one. */
export const AnalyserSchema = z.object({
  arms: z
    .array(z.object({ bothPorts: z.boolean().default(false) }))
    .length(2, "Describe the analysers of both arms (A, then B).")
    .default([{ bothPorts: false }, { bothPorts: false }]),
});

const shortText = z.string().trim().max(LIMITS.shortTextLength, `At most ${LIMITS.shortTextLength} characters.`);
const optionalMeasure = (what: string, unit: string, min: number, max: number) =>
  numberField(what).min(min, `${what} is at least ${min} ${unit}.`).max(max, `${what} is at most ${max} ${unit}.`).nullable();

export const LabSessionFieldsSchema = z.object({
  sourceId: UuidSchema("Source"),
  title: z.string().trim().min(1, "Give the session a title.").max(LIMITS.nameLength, `At most ${LIMITS.nameLength} characters.`),
  /** Calendar date of the session, YYYY-MM-DD. */
  date: z.iso.date("Date must be a calendar date, YYYY-MM-DD."),
  people: z.array(z.string().trim().min(1, "A name cannot be empty.").max(LIMITS.nameLength)).max(LIMITS.peoplePerSession, `At most ${LIMITS.peoplePerSession} people.`),
  pumpWavelengthNm: optionalMeasure("Pump wavelength", "nm", 100, 20_000),
  pumpPowerMw: optionalMeasure("Pump power", "mW", 0, 100_000),
  crystalTemperatureC: optionalMeasure("Crystal temperature", "°C", -273.15, 1000),
  /** Full width of the coincidence window, ns; the default for accidental subtraction. */
  coincidenceWindowNs: numberField("Coincidence window").positive("Coincidence window must be above 0 ns.").max(1_000_000, "Coincidence window is at most 1,000,000 ns.").nullable(),
  detectors: shortText,
  analyser: AnalyserSchema,
  /** Per arm (A, then B): calibration of its QWP and HWP. */
  calibration: z.array(ArmCalibrationSchema).length(2, "Give calibrations for both arms (A, then B)."),
  handedness: HandednessSchema,
  notes: z.string().max(LIMITS.notesLength, `Notes are at most ${LIMITS.notesLength} characters.`),
  /** Private notes are shown to lab members only, never through a share. */
  notesPrivate: z.boolean(),
});

export const CreateLabSessionSchema = LabSessionFieldsSchema.extend({
  people: LabSessionFieldsSchema.shape.people.default([]),
  pumpWavelengthNm: LabSessionFieldsSchema.shape.pumpWavelengthNm.default(null),
  pumpPowerMw: LabSessionFieldsSchema.shape.pumpPowerMw.default(null),
  crystalTemperatureC: LabSessionFieldsSchema.shape.crystalTemperatureC.default(null),
  coincidenceWindowNs: LabSessionFieldsSchema.shape.coincidenceWindowNs.default(null),
  detectors: shortText.default(""),
  analyser: AnalyserSchema.default({ arms: [{ bothPorts: false }, { bothPorts: false }] }),
  calibration: LabSessionFieldsSchema.shape.calibration.default([IDEAL_ARM, IDEAL_ARM]),
  handedness: HandednessSchema.default("R=H+iV"),
  notes: LabSessionFieldsSchema.shape.notes.default(""),
  notesPrivate: z.boolean().default(false),
});
export type CreateLabSession = z.infer<typeof CreateLabSessionSchema>;

/** PATCH: any subset. Changing the setup does not touch stored runs or reconstructions. */
export const UpdateLabSessionSchema = LabSessionFieldsSchema.partial().refine((b) => Object.keys(b).length > 0, "Change at least one field.");
export type UpdateLabSession = z.infer<typeof UpdateLabSessionSchema>;

export const LabSessionListQuerySchema = listQuery(["date", "title", "createdAt", "pumpPowerMw"], "date").extend({
  sourceId: UuidSchema("Source").optional(),
  from: z.iso.date("From must be a date, YYYY-MM-DD.").optional(),
  to: z.iso.date("To must be a date, YYYY-MM-DD.").optional(),
});
export type LabSessionListQuery = z.infer<typeof LabSessionListQuerySchema>;

export const LabSessionSchema = LabSessionFieldsSchema.extend({
  id: z.string().uuid(),
  labId: z.string().uuid(),
  source: z.object({ id: z.string().uuid(), name: z.string() }),
  runCount: z.number().int(),
  createdBy: PersonRefSchema,
  createdAt: z.string(),
  updatedAt: z.string(),
  can: AllowedActionsSchema,
});
export type LabSessionDto = z.infer<typeof LabSessionSchema>;

export const LabSessionPageSchema = pageOf(LabSessionSchema);
export type LabSessionPage = z.infer<typeof LabSessionPageSchema>;
