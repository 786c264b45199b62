import { LabIdParamsSchema } from "@shared/schemas/labs";
import { ChangeRoleSchema, MemberListSchema, MemberParamsSchema, MemberSchema } from "@shared/schemas/members";
import { ApiRouter } from "../http/endpoint";
import { allowedActions, authorizeLab, authorizeMemberRemoval } from "../policies/labAccess";
import { presentMember } from "../presenters/member";
import { changeRole, listMembers, removeMember } from "../services/members";

/** Members of a lab: everyone in the lab sees the list; owners change roles and remove people. */
export const membersRouter = new ApiRouter("/labs");
const tags = ["members"];

membersRouter.get("/:labId/members", { summary: "Members of a lab and their roles", auth: "user", tags, params: LabIdParamsSchema, response: MemberListSchema }, async ({ user, params }) => {
  const role = await authorizeLab(user, params.labId, "read");
  const members = await listMembers(params.labId);
  return { data: members.map((m) => presentMember(m, user.id)), can: allowedActions(role) };
});

membersRouter.patch("/:labId/members/:userId", { summary: "Change a member's role (owners; a lab keeps at least one owner)", auth: "user", tags, params: MemberParamsSchema, body: ChangeRoleSchema, response: MemberSchema }, async ({ user, params, body }) => {
  await authorizeLab(user, params.labId, "manage");
  return presentMember(await changeRole(params.labId, params.userId, body.role), user.id);
});

membersRouter.delete("/:labId/members/:userId", { summary: "Remove a member (owners), or leave the lab yourself", auth: "user", tags, params: MemberParamsSchema }, async ({ user, params }) => {
  await authorizeMemberRemoval(user, params.labId, params.userId);
  await removeMember(params.labId, params.userId);
  return undefined;
});
