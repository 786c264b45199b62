import { z } from "zod";
import { AllowedActionsSchema } from "./labs";
import { LabSessionSchema } from "./labSessions";
import { MethodSchema } from "./reconstructions";
import { RunSchema } from "./runs";
import { BellTargetSchema } from "./sources";

/** `GET /api/labs/:labId/home`: what the lab's first page shows. */
export const LabHomeSchema = z.object({
  totals: z.object({ sources: z.number().int(), sessions: z.number().int(), runs: z.number().int() }),
  recentSessions: z.array(LabSessionSchema),
  recentRuns: z.array(RunSchema),
  /** Per source, its highest fidelity to its target state among maximum-likelihood reconstructions of current counts. */
  bestBySource: z.array(
    z.object({
      source: z.object({ id: z.string().uuid(), name: z.string(), targetState: BellTargetSchema }),
      best: z
        .object({
          fidelity: z.number(),
          uncertainty: z.number().nullable(),
          method: MethodSchema,
          accidentalsSubtracted: z.boolean(),
          reconstructionId: z.string().uuid(),
          run: z.object({ id: z.string().uuid(), name: z.string() }),
          session: z.object({ id: z.string().uuid(), title: z.string(), date: z.string() }),
        })
        .nullable(),
    }),
  ),
  can: AllowedActionsSchema,
});
export type LabHomeDto = z.infer<typeof LabHomeSchema>;
