import {
  AcceptInvitationSchema,
  AcceptedInvitationSchema,
  CreateInvitationSchema,
  CreatedInvitationSchema,
  InvitationListSchema,
  InvitationParamsSchema,
  InvitationPreviewSchema,
  InvitationTokenSchema,
} from "@shared/schemas/invitations";
import { LabIdParamsSchema } from "@shared/schemas/labs";
import { ApiRouter } from "../http/endpoint";
import { startSignedInSession } from "../http/session";
import { authorizeLab } from "../policies/labAccess";
import { presentInvitation, presentInvitationPreview } from "../presenters/invitation";
import { presentLab } from "../presenters/lab";
import { acceptInvitation, createInvitation, listInvitations, previewInvitation, revokeInvitation } from "../services/invitations";

const tags = ["invitations"];

/** Owners invite people into their lab by e-mail. */
export const labInvitationsRouter = new ApiRouter("/labs");

labInvitationsRouter.get("/:labId/invitations", { summary: "Open invitations of a lab (owners)", auth: "user", tags, params: LabIdParamsSchema, response: InvitationListSchema }, async ({ user, params }) => {
  await authorizeLab(user, params.labId, "manage");
  return { data: (await listInvitations(params.labId)).map(presentInvitation) };
});

labInvitationsRouter.post("/:labId/invitations", { summary: "Invite someone by e-mail with a role (owners); replaces an open invitation to the same address", auth: "user", tags, params: LabIdParamsSchema, body: CreateInvitationSchema, response: CreatedInvitationSchema, status: 201 }, async ({ user, params, body }) => {
  await authorizeLab(user, params.labId, "manage");
  const { invitation, mail } = await createInvitation(user, params.labId, body);
  return { invitation: presentInvitation(invitation), mail };
});

labInvitationsRouter.delete("/:labId/invitations/:invitationId", { summary: "Withdraw an open invitation (owners)", auth: "user", tags, params: InvitationParamsSchema }, async ({ user, params }) => {
  await authorizeLab(user, params.labId, "manage");
  await revokeInvitation(params.labId, params.invitationId);
  return undefined;
});

/**
 * The person invited: the link's token travels in the body (not the URL) so it stays out of
 * request logs.
 */
export const invitationsRouter = new ApiRouter("/invitations");

invitationsRouter.post("/preview", { summary: "What an invitation link offers (lab, role, inviter), before accepting", auth: "public", tags, body: InvitationTokenSchema, response: InvitationPreviewSchema }, async ({ body }) => {
  const { invitation, accountExists } = await previewInvitation(body.token);
  return presentInvitationPreview(invitation, accountExists);
});

invitationsRouter.post("/accept", { summary: "Accept an invitation: adds the lab to your account, or creates the account", auth: "public", tags, body: AcceptInvitationSchema, response: AcceptedInvitationSchema }, async ({ req, res, user, body }) => {
  const accepted = await acceptInvitation(user, body);
  if (accepted.created) await startSignedInSession(req, res, accepted.userId);
  return { lab: presentLab(accepted.lab, accepted.role) };
});
