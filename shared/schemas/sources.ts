import { z } from "zod";
import { LIMITS } from "../limits";
import { AllowedActionsSchema } from "./labs";
import { listQuery, numberField, pageOf, PersonRefSchema, UuidSchema } from "./listing";

/** The four Bell states a source can aim at; the lab home ranks runs by fidelity to it. */
export const BellTargetSchema = z.enum(["phi+", "phi-", "psi+", "psi-"], "Target state is one of phi+, phi-, psi+, psi-.");
export type BellTarget = z.infer<typeof BellTargetSchema>;

export const SourceIdParamsSchema = z.object({ labId: UuidSchema("Lab id"), sourceId: UuidSchema("Source id") });

const name = z.string().trim().min(1, "Give the source a name.").max(LIMITS.nameLength, `At most ${LIMITS.nameLength} characters.`);
const shortText = z.string().trim().max(LIMITS.shortTextLength, `At most ${LIMITS.shortTextLength} characters.`);

export const CreateSourceSchema = z.object({
  name,
  /** e.g. "type-II ppKTP, 10 mm, in a polarization Sagnac loop" */
  crystal: shortText.default(""),
  /** e.g. "405 nm CW diode laser" */
  pumpLaser: shortText.default(""),
  /** Wavelength of the emitted pairs, nm. */
  wavelengthNm: numberField("Wavelength").positive("Wavelength must be above 0 nm.").max(20_000, "Wavelength is at most 20,000 nm.").nullable().default(null),
  targetState: BellTargetSchema.default("psi-"),
  notes: z.string().max(LIMITS.notesLength, `Notes are at most ${LIMITS.notesLength} characters.`).default(""),
});
export type CreateSource = z.infer<typeof CreateSourceSchema>;

/** PATCH: any subset of the creatable fields. */
export const UpdateSourceSchema = z
  .object({
    name,
    crystal: shortText,
    pumpLaser: shortText,
    wavelengthNm: CreateSourceSchema.shape.wavelengthNm.unwrap(),
    targetState: BellTargetSchema,
    notes: z.string().max(LIMITS.notesLength, `Notes are at most ${LIMITS.notesLength} characters.`),
  })
  .partial()
  .refine((b) => Object.keys(b).length > 0, "Change at least one field.");
export type UpdateSource = z.infer<typeof UpdateSourceSchema>;

export const SourceListQuerySchema = listQuery(["name", "createdAt", "updatedAt"], "name");
export type SourceListQuery = z.infer<typeof SourceListQuerySchema>;

export const SourceSchema = z.object({
  id: z.string().uuid(),
  labId: z.string().uuid(),
  name: z.string(),
  crystal: z.string(),
  pumpLaser: z.string(),
  wavelengthNm: z.number().nullable(),
  targetState: BellTargetSchema,
  notes: z.string(),
  sessionCount: z.number().int(),
  createdBy: PersonRefSchema,
  createdAt: z.string(),
  updatedAt: z.string(),
  can: AllowedActionsSchema,
});
export type SourceDto = z.infer<typeof SourceSchema>;

export const SourcePageSchema = pageOf(SourceSchema);
export type SourcePage = z.infer<typeof SourcePageSchema>;
