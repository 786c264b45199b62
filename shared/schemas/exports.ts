import { z } from "zod";
import { UuidSchema } from "./listing";
import { CorrectionsSchema, MethodSchema } from "./reconstructions";
import { ShareItemTypeSchema } from "./shares";

/**
 * Export files: their request parameters and the JSON layouts we write (ours, documented in
 * README "Sharing and exports"; shared/formats writes them).
 */
export const RECONSTRUCTION_FILES = ["rho.csv", "rho.json", "metrics.csv", "metrics.json"] as const;
export const ReconstructionExportParamsSchema = z.object({
  labId: UuidSchema("Lab id"),
  reconstructionId: UuidSchema("Reconstruction id"),
  file: z.enum(RECONSTRUCTION_FILES, `File is one of: ${RECONSTRUCTION_FILES.join(", ")}.`),
});

export const RunCountsQuerySchema = z.object({
  /** Which revision's rows (default: the current one). */
  revision: z.coerce.number().int("Revision must be a whole number.").min(1, "Revisions start at 1.").optional(),
});

export const SESSION_FILES = ["metrics.csv", "metrics.json"] as const;
export const SessionExportParamsSchema = z.object({
  labId: UuidSchema("Lab id"),
  sessionId: UuidSchema("Session id"),
  file: z.enum(SESSION_FILES, `File is one of: ${SESSION_FILES.join(", ")}.`),
});

export const BundleExportQuerySchema = z.object({
  /** Private session notes stay out of a bundle unless asked for explicitly. */
  includePrivateNotes: z.enum(["true", "false"], "includePrivateNotes is true or false.").default("false").transform((v) => v === "true"),
});

export const ReportParamsSchema = z.object({ labId: UuidSchema("Lab id"), itemType: ShareItemTypeSchema, itemId: UuidSchema("Item id") });

/**
 * Importing a bundle: multipart with the file `bundle` (and the field `sourceId`), or JSON with
 * the bundle itself under `bundle` (for scripts; the JSON body limit of the API applies).
 */
export const ImportBundleFieldsSchema = z.object({
  /** Put the session under this source of the lab instead of the bundle's own source. */
  sourceId: UuidSchema("Source").optional(),
  bundle: z.unknown().optional(),
});

export const ImportedBundleSchema = z.object({
  session: z.object({ id: z.string().uuid(), title: z.string() }),
  source: z.object({ id: z.string().uuid(), name: z.string(), created: z.boolean() }),
  runs: z.number().int(),
  revisions: z.number().int(),
  reconstructions: z.number().int(),
  attachments: z.number().int(),
});
export type ImportedBundle = z.infer<typeof ImportedBundleSchema>;

/* ——— JSON layouts of the export files ——— */

/** Where a reconstruction comes from, in words a reader outside the lab understands. */
export const ExportContextSchema = z.object({
  source: z.string(),
  session: z.string(),
  sessionDate: z.string(),
  run: z.string(),
  revision: z.number().int(),
});
export type ExportContext = z.infer<typeof ExportContextSchema>;

export const ExportMethodSchema = z.object({
  method: MethodSchema,
  corrections: CorrectionsSchema,
  physical: z.boolean(),
  monteCarlo: z.object({ samples: z.number().int(), seed: z.number().int() }).nullable(),
  engineVersion: z.string(),
  computedAt: z.string(),
});

const nullableMatrix = z.array(z.array(z.number())).nullable();

/** rho.json */
export const RhoExportSchema = z.object({
  format: z.literal("rhomb-density-matrix"),
  formatVersion: z.literal(1),
  context: ExportContextSchema,
  reconstruction: ExportMethodSchema,
  /** Row and column order of the matrices: H = 0, V = 1, photon A first. */
  basis: z.array(z.string()),
  real: z.array(z.array(z.number())),
  imaginary: z.array(z.array(z.number())),
  /** One Monte Carlo standard deviation per element; null without samples. */
  sigmaReal: nullableMatrix,
  sigmaImaginary: nullableMatrix,
  eigenvalues: z.array(z.number()),
});
export type RhoExport = z.infer<typeof RhoExportSchema>;

export const FigureSchema = z.object({ value: z.number().nullable(), sigma: z.number().nullable() });

/** metrics.json: one item per reconstruction (one for a reconstruction, all of a session's). */
export const MetricsExportSchema = z.object({
  format: z.literal("rhomb-figures-of-merit"),
  formatVersion: z.literal(1),
  items: z.array(
    z.object({
      context: ExportContextSchema,
      reconstruction: ExportMethodSchema,
      figures: z.record(z.string(), FigureSchema),
    }),
  ),
});
export type MetricsExport = z.infer<typeof MetricsExportSchema>;
