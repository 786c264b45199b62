import { z } from "zod";
import { LIMITS } from "../limits";
import { MatrixSchema, MethodSchema, ReconstructionSchema } from "./reconstructions";
import { RunSchema } from "./runs";
import { UuidSchema } from "./listing";

const uuidList = (what: string) =>
  z
    .string()
    .transform((s) => s.split(",").map((x) => x.trim()).filter(Boolean))
    .pipe(z.array(UuidSchema(what)).min(2, `Choose at least 2 ${what.toLowerCase()}s to compare.`).max(LIMITS.compareRuns, `Compare at most ${LIMITS.compareRuns} at once.`));

/**
 * `GET /api/labs/:labId/compare?runs=a,b,c&method=mle` — the newest reconstruction of that
 * method for each run's current counts; or `?reconstructions=x,y` to pick them exactly.
 * Differences are "this item minus the first". With neither, the comparison is empty (nothing
 * chosen yet).
 */
export const CompareQuerySchema = z
  .object({
    runs: uuidList("Run").optional(),
    reconstructions: uuidList("Reconstruction").optional(),
    method: MethodSchema.default("mle"),
  })
  .refine((q) => !(q.runs && q.reconstructions), { message: "Give either runs or reconstructions, not both.", path: ["runs"] });
export type CompareQuery = z.infer<typeof CompareQuerySchema>;

export const CompareDifferenceSchema = z.object({
  runId: z.string().uuid(),
  relativeToRunId: z.string().uuid(),
  /** Δ = this − first, with σ_Δ = √(σ₁² + σ₂²) where both have Monte Carlo uncertainties. */
  metrics: z.record(z.string(), z.object({ delta: z.number(), uncertainty: z.number().nullable() })),
  rho: MatrixSchema,
  /** ½‖ρ − ρ₁‖₁ (Nielsen & Chuang, Quantum Computation and Quantum Information, 2000, §9.2). */
  traceDistance: z.number(),
  /** Uhlmann–Jozsa fidelity between the two states (physics contract §6); null if either is not physical. */
  fidelityBetween: z.number().nullable(),
});

export const CompareSchema = z.object({
  method: MethodSchema,
  items: z.array(z.object({ run: RunSchema, reconstruction: ReconstructionSchema })),
  differences: z.array(CompareDifferenceSchema),
});
export type CompareDto = z.infer<typeof CompareSchema>;


