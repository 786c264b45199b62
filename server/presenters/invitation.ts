import type { InvitationDto, InvitationPreview } from "@shared/schemas/invitations";
import type { Invitation } from "../entities/Invitation";

const inviterName = (inv: Invitation) => inv.invitedBy?.displayName ?? "A former member";

/** `relations: { invitedBy: true }` must be loaded. */
export function presentInvitation(inv: Invitation): InvitationDto {
  return {
    id: inv.id,
    email: inv.email,
    role: inv.role,
    status: inv.expiresAt.getTime() < Date.now() ? "expired" : "pending",
    invitedBy: inviterName(inv),
    createdAt: inv.createdAt.toISOString(),
    expiresAt: inv.expiresAt.toISOString(),
  };
}

/** `relations: { lab: true, invitedBy: true }` must be loaded. */
export function presentInvitationPreview(inv: Invitation, accountExists: boolean): InvitationPreview {
  return { labName: inv.lab!.name, institution: inv.lab!.institution, invitedBy: inviterName(inv), email: inv.email, role: inv.role, expiresAt: inv.expiresAt.toISOString(), accountExists };
}
