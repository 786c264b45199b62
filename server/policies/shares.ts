import type { LabRole } from "@shared/schemas/roles";
import type { Share } from "../entities/Share";
import type { AuthUser } from "../http/auth";
import { gone, notFound } from "../http/errors";
import { authorizeLab } from "./labAccess";

/**
 * Shares, exports and bundles. Everyone in the lab sees its shares, exports and reports;
 * members and owners share items, revoke shares and import bundles (sharing is "write", see
 * labAccess). Outside the lab, a share opens its one item: a link to whoever holds its token,
 * a guest share to the signed-in account with the invited address — and only while neither
 * expired nor revoked.
 */
export const sharePolicy = {
  list: (user: AuthUser, labId: string): Promise<LabRole> => authorizeLab(user, labId, "read"),
  create: (user: AuthUser, labId: string): Promise<LabRole> => authorizeLab(user, labId, "write"),
  revoke: (user: AuthUser, labId: string): Promise<LabRole> => authorizeLab(user, labId, "write"),
  export: (user: AuthUser, labId: string): Promise<LabRole> => authorizeLab(user, labId, "read"),
  importBundle: (user: AuthUser, labId: string): Promise<LabRole> => authorizeLab(user, labId, "write"),
};

const when = (d: Date) => d.toUTCString().replace(" GMT", " UTC");

/** 410 with a message saying why, when the share no longer opens anything. */
export function assertShareOpen(share: Share, now = Date.now()): void {
  const what = share.kind === "link" ? "share link" : "shared item";
  if (share.revokedAt) throw gone(`This ${what} is no longer valid: the lab revoked it on ${when(share.revokedAt)}. Ask the person who shared it for a new one if you still need it.`);
  if (share.expiresAt && share.expiresAt.getTime() <= now) throw gone(`This ${what} is no longer valid: it expired on ${when(share.expiresAt)}. Ask the person who shared it for a new one if you still need it.`);
}

/** A guest share opens for the account with the invited address only; others get 404. */
export function assertGuestOf(user: AuthUser, share: Share | null): asserts share is Share {
  if (!share || share.kind !== "guest" || share.email !== user.email.toLowerCase()) throw notFound("Shared item");
}
