import { z } from "zod";

export const HealthSchema = z.object({
  status: z.enum(["ok", "degraded"]),
  api: z.object({ status: z.literal("up"), version: z.string(), uptimeSeconds: z.number() }),
  database: z.discriminatedUnion("status", [
    z.object({ status: z.literal("up"), latencyMs: z.number(), version: z.string() }),
    z.object({ status: z.literal("down"), error: z.string() }),
  ]),
});
export type Health = z.infer<typeof HealthSchema>;
