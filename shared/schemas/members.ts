import { z } from "zod";
import { AllowedActionsSchema } from "./labs";
import { LabRoleSchema } from "./roles";

export const MemberParamsSchema = z.object({
  labId: z.string().uuid("Lab id must be a UUID."),
  userId: z.string().uuid("User id must be a UUID."),
});

export const MemberSchema = z.object({
  userId: z.string().uuid(),
  email: z.string(),
  displayName: z.string(),
  role: LabRoleSchema,
  joinedAt: z.string(),
  isYou: z.boolean(),
});
export type MemberDto = z.infer<typeof MemberSchema>;

export const MemberListSchema = z.object({ data: z.array(MemberSchema), can: AllowedActionsSchema });
export type MemberList = z.infer<typeof MemberListSchema>;

export const ChangeRoleSchema = z.object({ role: LabRoleSchema });
export type ChangeRole = z.infer<typeof ChangeRoleSchema>;
