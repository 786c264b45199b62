import { z } from "zod";
import { RunIdParamsSchema } from "./runs";

export const FringeScanParamsSchema = RunIdParamsSchema;

const nonNegative = (what: string) => z.coerce.number(`${what} must be a number.`).min(0, `${what} cannot be negative.`);

/**
 * Background of the fringe fit (it cannot be fitted — see shared/physics/fringe/fit.ts):
 * none; each row's accidentals from its singles (window: `windowNs`, else the session's); or a
 * fixed rate ± σ in counts per second (e.g. a measured dark level).
 */
export const FringeScanQuerySchema = z
  .object({
    background: z.enum(["none", "accidentals", "rate"], "Background is none, accidentals or rate.").default("none"),
    windowNs: nonNegative("Window").positive("Window must be above 0 ns.").optional(),
    backgroundRate: nonNegative("Background rate").optional(),
    backgroundSigma: nonNegative("Background σ").default(0),
  })
  .superRefine((q, ctx) => {
    if (q.background === "rate" && q.backgroundRate === undefined) {
      ctx.addIssue({ code: "custom", path: ["backgroundRate"], message: "Give the background rate (counts per second) for background=rate." });
    }
  });
export type FringeScanQuery = z.infer<typeof FringeScanQuerySchema>;

export const FringeBasisSchema = z.enum(["HV", "DA", "other"]);

export const FringePointSchema = z.object({
  angleDeg: z.number(),
  counts: z.number(),
  seconds: z.number(),
  /** Expected background counts of this row (0 without background). */
  backgroundCounts: z.number(),
});

export const FringeFitSchema = z.object({
  c0: z.number(),
  sigmaC0: z.number(),
  visibility: z.number(),
  sigmaVisibility: z.number(),
  phaseDeg: z.number(),
  sigmaPhaseDeg: z.number(),
  backgroundRate: z.number(),
  chiSquare: z.number(),
  degreesOfFreedom: z.number().int(),
  iterations: z.number().int(),
  converged: z.boolean(),
});
export type FringeFitDto = z.infer<typeof FringeFitSchema>;

export const FringeScanResultSchema = z.object({
  scannedArm: z.enum(["A", "B"]),
  fixedAngleDeg: z.number(),
  basis: FringeBasisSchema,
  rows: z.array(z.number().int()),
  points: z.array(FringePointSchema),
  fit: FringeFitSchema,
  /** V = (C_max − C_min)/(C_max + C_min) of the raw rates. */
  extremes: z.object({ visibility: z.number(), sigma: z.number(), maxRow: z.number().int(), minRow: z.number().int() }),
});
export type FringeScanResultDto = z.infer<typeof FringeScanResultSchema>;

export const FringeAnalysisSchema = z.object({
  runId: z.string().uuid(),
  runName: z.string(),
  sessionId: z.string().uuid(),
  revisionNumber: z.number().int(),
  background: z.object({ kind: z.enum(["none", "accidentals", "rate"]), windowNs: z.number().nullable(), rate: z.number().nullable(), sigma: z.number() }),
  scans: z.array(FringeScanResultSchema),
  byBasis: z.array(z.object({ basis: FringeBasisSchema, scans: z.number().int(), visibility: z.number(), sigma: z.number().nullable() })),
});
export type FringeAnalysisDto = z.infer<typeof FringeAnalysisSchema>;
