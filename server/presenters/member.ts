import type { MemberDto } from "@shared/schemas/members";
import type { LabMembership } from "../entities/LabMembership";

/** `relations: { user: true }` must be loaded. */
export function presentMember(m: LabMembership, callerId: string): MemberDto {
  return { userId: m.userId, email: m.user!.email, displayName: m.user!.displayName, role: m.role, joinedAt: m.createdAt.toISOString(), isYou: m.userId === callerId };
}
