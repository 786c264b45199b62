import { z } from "zod";
import { RunIdParamsSchema } from "./runs";
import { MethodSchema } from "./reconstructions";
import { UuidSchema } from "./listing";

export const BellTestParamsSchema = RunIdParamsSchema;

const angleParam = (what: string) =>
  z.coerce
    .number(`${what} must be a number of degrees.`)
    .min(-360, `${what} is between −360° and 360°.`)
    .max(360, `${what} is between −360° and 360°.`)
    .optional();

/**
 * Analyser angles a, a′, b, b′ (linear-polariser degrees; physics contract §7). Give all four or
 * none: without them the standard angles are used when the rows contain them, else the rows'.
 * `reconstructionId` picks the ρ to compare with; default: the session's newest MLE of a
 * tomography run.
 */
export const BellTestQuerySchema = z
  .object({
    aDeg: angleParam("a"),
    aPrimeDeg: angleParam("a′"),
    bDeg: angleParam("b"),
    bPrimeDeg: angleParam("b′"),
    reconstructionId: UuidSchema("Reconstruction").optional(),
  })
  .superRefine((q, ctx) => {
    const keys = ["aDeg", "aPrimeDeg", "bDeg", "bPrimeDeg"] as const;
    const given = keys.filter((k) => q[k] !== undefined);
    if (given.length > 0 && given.length < 4) {
      for (const k of keys.filter((k) => q[k] === undefined)) ctx.addIssue({ code: "custom", path: [k], message: "Give all four angles a, a′, b, b′, or none." });
    }
  });
export type BellTestQuery = z.infer<typeof BellTestQuerySchema>;

export const BellAnglesSchema = z.object({ aDeg: z.number(), aPrimeDeg: z.number(), bDeg: z.number(), bPrimeDeg: z.number() });

export const SettingPairNameSchema = z.enum(["a,b", "a,b'", "a',b", "a',b'"]);

export const BellCorrelationSchema = z.object({
  name: SettingPairNameSchema,
  alphaDeg: z.number(),
  betaDeg: z.number(),
  /** Sign of this E in S. */
  sign: z.union([z.literal(1), z.literal(-1)]),
  value: z.number(),
  sigma: z.number(),
  totalCounts: z.number(),
  /** 0-based rows used: C(α,β), C(α⊥,β⊥), C(α,β⊥), C(α⊥,β). */
  rows: z.array(z.number().int()).length(4),
  /** E that the compared ρ predicts at the same angles; null without a ρ. */
  predicted: z.number().nullable(),
});

export const BellPredictionSchema = z.object({
  reconstructionId: z.string().uuid(),
  runId: z.string().uuid(),
  runName: z.string(),
  method: MethodSchema,
  physical: z.boolean(),
  /** S that ρ predicts at the run's angles. */
  s: z.number(),
  /** Horodecki maximum 2√(m₁ + m₂) over all analysers, and its Monte Carlo σ when stored. */
  maximum: z.number(),
  maximumSigma: z.number().nullable(),
});

export const BellTestSchema = z.object({
  runId: z.string().uuid(),
  runName: z.string(),
  sessionId: z.string().uuid(),
  revisionNumber: z.number().int(),
  angles: BellAnglesSchema,
  anglesOrigin: z.enum(["given", "standard", "fromRows"]),
  correlations: z.array(BellCorrelationSchema).length(4),
  s: z.number(),
  sigmaS: z.number(),
  /** (|S| − 2)/σ_S */
  significance: z.number().nullable(),
  totalCounts: z.number(),
  prediction: BellPredictionSchema.nullable(),
  /** Why there is no prediction, when there is none. */
  predictionNote: z.string().nullable(),
});
export type BellTestDto = z.infer<typeof BellTestSchema>;
