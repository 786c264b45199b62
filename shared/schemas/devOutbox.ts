import { z } from "zod";

export const CaughtMailSchema = z.object({
  id: z.string(),
  receivedAt: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  links: z.array(z.string()),
});
export type CaughtMailDto = z.infer<typeof CaughtMailSchema>;

export const DevOutboxSchema = z.object({ data: z.array(CaughtMailSchema) });
