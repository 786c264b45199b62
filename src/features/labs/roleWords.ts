import type { LabRole } from "@shared/schemas/roles";

/** What each role may do, in the words the interface uses everywhere. */
export const roleWords: Record<LabRole, { label: string; article: string; can: string }> = {
  owner: { label: "Owner", article: "an", can: "everything a member can, plus people, roles, invitations and deleting the lab" },
  member: { label: "Member", article: "a", can: "add and edit sources, sessions, runs and reconstructions, and share them" },
  viewer: { label: "Viewer", article: "a", can: "read everything in the lab, change nothing" },
};

export const ROLE_ORDER: LabRole[] = ["owner", "member", "viewer"];
