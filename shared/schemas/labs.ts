import { z } from "zod";
import { LIMITS } from "../limits";
import { LabRoleSchema } from "./roles";

export const LabIdParamsSchema = z.object({ labId: z.string().uuid("Lab id must be a UUID.") });

export const CreateLabSchema = z.object({
  name: z.string().trim().min(1, "Give the lab a name.").max(LIMITS.nameLength, `At most ${LIMITS.nameLength} characters.`),
  institution: z.string().trim().max(LIMITS.nameLength, `At most ${LIMITS.nameLength} characters.`).default(""),
});
export type CreateLab = z.infer<typeof CreateLabSchema>;

export const AllowedActionsSchema = z.object({ read: z.boolean(), write: z.boolean(), manage: z.boolean() });

export const LabSchema = z.object({
  id: z.string().uuid(),
  name: z.string(),
  institution: z.string(),
  role: LabRoleSchema,
  createdAt: z.string(),
  can: AllowedActionsSchema,
});
export type LabDto = z.infer<typeof LabSchema>;

export const LabListSchema = z.object({ data: z.array(LabSchema) });

export const UpdateLabSchema = z.object({
  name: CreateLabSchema.shape.name.optional(),
  institution: z.string().trim().max(LIMITS.nameLength, `At most ${LIMITS.nameLength} characters.`).optional(),
});
export type UpdateLab = z.infer<typeof UpdateLabSchema>;
