import { z } from "zod";
import { LabIdParamsSchema } from "./labs";
import { UuidSchema } from "./listing";
import { METRIC_KEYS, MethodSchema } from "./reconstructions";
import { RunKindSchema } from "./runs";

export const TrendParamsSchema = LabIdParamsSchema;

/**
 * The runs of one session, one source, or (with neither) the whole lab, each with every figure
 * and every x-value, so the client can plot any figure against any parameter without asking again.
 * `method` picks which reconstruction of a tomography run supplies the figures (the newest of
 * that method for the run's current counts); `accidentals` prefers one with accidentals
 * subtracted (true) or without (false).
 */
export const TrendQuerySchema = z
  .object({
    sessionId: UuidSchema("Session").optional(),
    sourceId: UuidSchema("Source").optional(),
    method: MethodSchema.default("mle"),
    accidentals: z
      .enum(["true", "false"], "Accidentals is true or false.")
      .transform((v) => v === "true")
      .default(false),
  })
  .superRefine((q, ctx) => {
    if (q.sessionId && q.sourceId) ctx.addIssue({ code: "custom", path: ["sourceId"], message: "Give a session or a source, not both." });
  });
export type TrendQuery = z.infer<typeof TrendQuerySchema>;

/** The x-axes a trend can use. */
export const TREND_X_KEYS = ["pumpPowerMw", "crystalTemperatureC", "compensatorTiltDeg", "exposureSeconds", "recordedAt", "order"] as const;
export type TrendXKey = (typeof TREND_X_KEYS)[number];

/** The figures a trend can plot: reconstruction metrics, fidelity to the source's target, |S| of Bell runs (default angles), fitted visibilities of fringe runs (no background). */
export const TREND_FIGURE_KEYS = [...METRIC_KEYS, "fidelityTarget", "chshAbsS", "visibilityHV", "visibilityDA"] as const;
export type TrendFigureKey = (typeof TREND_FIGURE_KEYS)[number];

export const ValueWithSigmaSchema = z.object({ value: z.number(), sigma: z.number().nullable() });
export type ValueWithSigma = z.infer<typeof ValueWithSigmaSchema>;

export const TrendRunSchema = z.object({
  runId: z.string().uuid(),
  name: z.string(),
  kind: RunKindSchema,
  sessionId: z.string().uuid(),
  sessionTitle: z.string(),
  /** x-values; null when the run does not record that parameter. recordedAt is ms since 1970. */
  x: z.object(Object.fromEntries(TREND_X_KEYS.map((k) => [k, z.number().nullable()])) as Record<TrendXKey, z.ZodNullable<z.ZodNumber>>),
  figures: z.object(Object.fromEntries(TREND_FIGURE_KEYS.map((k) => [k, ValueWithSigmaSchema.nullable()])) as Record<TrendFigureKey, z.ZodNullable<typeof ValueWithSigmaSchema>>),
  /** Coincidences per second summed over one complete analyser basis (see server/services/trends.ts). */
  pairRate: ValueWithSigmaSchema.nullable(),
  /** Σ s_a·s_b·τ/t over the rows ÷ Σ t: accidental coincidences per second. */
  accidentalRate: z.number().nullable(),
  /** Which reconstruction supplied the metrics (null for Bell and fringe runs or when none fits the query). */
  reconstructionId: z.string().uuid().nullable(),
  /** Why a figure is missing, e.g. an analysis that failed on this run's rows. */
  notes: z.array(z.string()),
});
export type TrendRunDto = z.infer<typeof TrendRunSchema>;

export const TrendSchema = z.object({
  /** targetState is null for a whole lab, whose sources may aim at different states. */
  scope: z.object({ kind: z.enum(["session", "source", "lab"]), id: z.string().uuid(), title: z.string(), targetState: z.string().nullable() }),
  method: MethodSchema,
  accidentals: z.boolean(),
  runs: z.array(TrendRunSchema),
});
export type TrendDto = z.infer<typeof TrendSchema>;
