import type { GuestShareDto, ShareDto, ShareStatus } from "@shared/schemas/shares";
import type { Share } from "../entities/Share";
import { presentPerson } from "./person";

export function shareStatus(share: Pick<Share, "revokedAt" | "expiresAt">, now = Date.now()): ShareStatus {
  if (share.revokedAt) return "revoked";
  if (share.expiresAt && share.expiresAt.getTime() <= now) return "expired";
  return "active";
}

export const shareItemId = (s: Share): string => (s.itemType === "session" ? s.sessionId : s.itemType === "run" ? s.runId : s.reconstructionId)!;

/** The lab's view of one of its shares; `createdBy` and `revokedBy` must be loaded. */
export function presentShare(s: Share, itemTitle: string): ShareDto {
  return {
    id: s.id,
    kind: s.kind,
    itemType: s.itemType,
    itemId: shareItemId(s),
    itemTitle,
    label: s.label,
    email: s.email,
    status: shareStatus(s),
    createdBy: presentPerson(s.createdBy),
    createdAt: s.createdAt.toISOString(),
    expiresAt: s.expiresAt?.toISOString() ?? null,
    revokedBy: presentPerson(s.revokedBy),
    revokedAt: s.revokedAt?.toISOString() ?? null,
    openCount: s.openCount,
    lastOpenedAt: s.lastOpenedAt?.toISOString() ?? null,
  };
}

/** The guest's view: what it is, whose lab, who shared it — not the lab's own label or counts. */
export function presentGuestShare(s: Share, itemTitle: string): GuestShareDto {
  return {
    id: s.id,
    itemType: s.itemType,
    itemTitle,
    lab: { name: s.lab!.name, institution: s.lab!.institution },
    sharedBy: s.createdBy?.displayName ?? "A former member of the lab",
    status: shareStatus(s),
    createdAt: s.createdAt.toISOString(),
    expiresAt: s.expiresAt?.toISOString() ?? null,
  };
}
