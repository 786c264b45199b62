import { z } from "zod";
import { DisplayNameSchema, EmailSchema, LinkTokenSchema, NewPasswordSchema } from "./auth";
import { LabSchema } from "./labs";
import { LabRoleSchema } from "./roles";

/** Invitations last this long; after that the link answers 410 and the owner sends a new one. */
export const INVITATION_DAYS = 7;

export const InvitationParamsSchema = z.object({
  labId: z.string().uuid("Lab id must be a UUID."),
  invitationId: z.string().uuid("Invitation id must be a UUID."),
});

export const CreateInvitationSchema = z.object({
  email: EmailSchema,
  role: LabRoleSchema.default("member"),
});
export type CreateInvitation = z.infer<typeof CreateInvitationSchema>;

export const InvitationStatusSchema = z.enum(["pending", "expired"]);

export const InvitationSchema = z.object({
  id: z.string().uuid(),
  email: z.string(),
  role: LabRoleSchema,
  status: InvitationStatusSchema,
  invitedBy: z.string(),
  createdAt: z.string(),
  expiresAt: z.string(),
});
export type InvitationDto = z.infer<typeof InvitationSchema>;

export const InvitationListSchema = z.object({ data: z.array(InvitationSchema) });

/** Whether the e-mail went out: the invitation is stored either way (mail is sent after commit). */
export const MailReportSchema = z.object({ sent: z.boolean(), error: z.string().optional() });

export const CreatedInvitationSchema = z.object({ invitation: InvitationSchema, mail: MailReportSchema });
export type CreatedInvitation = z.infer<typeof CreatedInvitationSchema>;

export const InvitationTokenSchema = z.object({ token: LinkTokenSchema });

/** What the holder of an invitation link may see before accepting. */
export const InvitationPreviewSchema = z.object({
  labName: z.string(),
  institution: z.string(),
  invitedBy: z.string(),
  email: z.string(),
  role: LabRoleSchema,
  expiresAt: z.string(),
  accountExists: z.boolean(),
});
export type InvitationPreview = z.infer<typeof InvitationPreviewSchema>;

/**
 * Accepting: a signed-in caller sends only the token; someone without an account also sends a
 * name and password, and the account is created for the invited address (the link proves it).
 */
export const AcceptInvitationSchema = z.object({
  token: LinkTokenSchema,
  displayName: DisplayNameSchema.optional(),
  password: NewPasswordSchema.optional(),
});
export type AcceptInvitation = z.infer<typeof AcceptInvitationSchema>;

export const AcceptedInvitationSchema = z.object({ lab: LabSchema });
