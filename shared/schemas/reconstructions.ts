import { z } from "zod";
import { LIMITS } from "../limits";
import { AllowedActionsSchema } from "./labs";
import { numberField, PersonRefSchema, UuidSchema } from "./listing";

export const ReconstructionIdParamsSchema = z.object({ labId: UuidSchema("Lab id"), reconstructionId: UuidSchema("Reconstruction id") });

export const MethodSchema = z.enum(["linear", "mle", "projected"], "Method is linear, mle or projected.");
export type ReconstructionMethod = z.infer<typeof MethodSchema>;

/**
 * Correction parameters of one reconstruction (physics contract §3). Raw counts are never
 * changed; these say how the estimator reads them.
 */
export const CorrectionsSchema = z.object({
  /** Subtract accidentals A_k = s_a·s_b·τ/t_k (needs singles on every row). */
  accidentals: z.boolean().default(false),
  /** τ, full coincidence window in ns; null → the session's window. */
  windowNs: numberField("Window").positive("Window must be above 0 ns.").nullable().default(null),
  /** Relative detector-pair efficiency per row (same order as the rows); null → all 1. */
  efficiencies: z.array(numberField("Efficiency").positive("Efficiencies must be above 0.")).nullable().default(null),
  drift: z.enum(["none", "monitor", "singles"], "Drift is none, monitor or singles.").default("none"),
});
export type Corrections = z.infer<typeof CorrectionsSchema>;

export const CreateReconstructionSchema = z.object({
  method: MethodSchema,
  corrections: CorrectionsSchema.default({ accidentals: false, windowNs: null, efficiencies: null, drift: "none" }),
  monteCarloSamples: z.number().int("Samples must be a whole number.").min(0, "Samples cannot be negative.").max(LIMITS.monteCarloMax, `At most ${LIMITS.monteCarloMax} samples.`).refine((n) => n !== 1, "Use 0 (no uncertainties) or at least 2 samples.").default(LIMITS.monteCarloDefault),
  /** Seed of the Monte Carlo draws; stored so the uncertainties reproduce. Random when absent. */
  seed: z.number().int().min(0).max(2 ** 31 - 1).optional(),
});
export type CreateReconstruction = z.infer<typeof CreateReconstructionSchema>;

/**
 * Figures of merit (physics contract §6). Fidelities to the four Bell states; phase-optimised
 * fidelity of the HV/VH family ("psi") and the HH/VV family ("phi") with the optimal phase φ
 * in degrees; null where a figure does not apply (e.g. CHSH for one photon).
 */
export const METRIC_KEYS = [
  "fidelityPhiPlus",
  "fidelityPhiMinus",
  "fidelityPsiPlus",
  "fidelityPsiMinus",
  "phaseFidelityPsi",
  "phasePsiDeg",
  "phaseFidelityPhi",
  "phasePhiDeg",
  "concurrence",
  "tangle",
  "purity",
  "linearEntropy",
  "vonNeumannEntropy",
  "negativity",
  "chshMax",
] as const;
export type MetricKey = (typeof METRIC_KEYS)[number];
export const MetricsSchema = z.object(Object.fromEntries(METRIC_KEYS.map((k) => [k, z.number().nullable()])) as Record<MetricKey, z.ZodNullable<z.ZodNumber>>);
export type Metrics = z.infer<typeof MetricsSchema>;

/** Fidelity key for each Bell target, e.g. "psi-" → fidelityPsiMinus. */
export const FIDELITY_KEY: Record<"phi+" | "phi-" | "psi+" | "psi-", MetricKey> = {
  "phi+": "fidelityPhiPlus",
  "phi-": "fidelityPhiMinus",
  "psi+": "fidelityPsiPlus",
  "psi-": "fidelityPsiMinus",
};

export const MatrixSchema = z.object({ re: z.array(z.array(z.number())), im: z.array(z.array(z.number())) });

export const WarningSchema = z.object({ code: z.string(), message: z.string() });

export const ReconstructionSchema = z.object({
  id: z.string().uuid(),
  labId: z.string().uuid(),
  runId: z.string().uuid(),
  revisionId: z.string().uuid(),
  revisionNumber: z.number().int(),
  method: MethodSchema,
  /** As resolved for this reconstruction (windowNs filled in from the session when used). */
  corrections: CorrectionsSchema,
  /** Setup conventions the projectors were built with (copied from the session at the time). */
  conventions: z.object({
    handedness: z.enum(["R=H+iV", "R=H-iV"]),
    calibration: z.array(z.object({ qwp: z.object({ fastAxisOffsetDeg: z.number(), retardanceErrorDeg: z.number() }), hwp: z.object({ fastAxisOffsetDeg: z.number(), retardanceErrorDeg: z.number() }) })),
    bothPorts: z.array(z.boolean()),
  }),
  rho: MatrixSchema,
  /** Eigenvalues of ρ, descending; a negative one marks a non-physical (linear) estimate. */
  eigenvalues: z.array(z.number()),
  physical: z.boolean(),
  metrics: MetricsSchema,
  /** Monte Carlo standard deviations; null when no samples were drawn. */
  uncertainties: z
    .object({
      samples: z.number().int(),
      seed: z.number().int(),
      metrics: MetricsSchema,
      rho: MatrixSchema,
    })
    .nullable(),
  fit: z.object({
    /** L = Σ n_k ln μ_k − μ_k (physics contract §4); null for methods without a likelihood fit. */
    logLikelihood: z.number().nullable(),
    iterations: z.number().int().nullable(),
    converged: z.boolean().nullable(),
    tolerance: z.number().nullable(),
  }),
  counts: z.object({ total: z.number(), clippedRows: z.array(z.number().int()) }),
  warnings: z.array(WarningSchema),
  engineVersion: z.string(),
  createdBy: PersonRefSchema,
  createdAt: z.string(),
  can: AllowedActionsSchema,
});
export type ReconstructionDto = z.infer<typeof ReconstructionSchema>;

/** Key figures shown in run tables: fidelity to the source's target and a few more, with σ. */
export const HeadlineSchema = z.object({
  reconstructionId: z.string().uuid(),
  method: MethodSchema,
  accidentalsSubtracted: z.boolean(),
  fidelity: z.number().nullable(),
  fidelityUncertainty: z.number().nullable(),
  concurrence: z.number().nullable(),
  concurrenceUncertainty: z.number().nullable(),
  purity: z.number().nullable(),
  purityUncertainty: z.number().nullable(),
  chshMax: z.number().nullable(),
  chshMaxUncertainty: z.number().nullable(),
});
export type HeadlineDto = z.infer<typeof HeadlineSchema>;
