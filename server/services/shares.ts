import type { EntityManager } from "typeorm";
import { SHARE_MAX_DAYS, type CreateShare, type ShareListQuery } from "@shared/schemas/shares";
import { db } from "../db/dataSource";
import { LabMembership } from "../entities/LabMembership";
import { Share } from "../entities/Share";
import { User } from "../entities/User";
import type { AuthUser } from "../http/auth";
import { conflict, invalid, notFound } from "../http/errors";
import { sendMail, type MailReport } from "../mail/mailer";
import { assertGuestOf, assertShareOpen } from "../policies/shares";
import { shareItemId, shareStatus } from "../presenters/sharedAccess";
import { recordAudit } from "./audit";
import { hashLinkToken, newLinkToken } from "./linkTokens";
import { guestShareMail } from "./shareMail";
import { itemTitles, loadSnapshotData, type SnapshotData } from "./shareSnapshots";

export interface ShareWithTitle {
  share: Share;
  itemTitle: string;
}

const ITEM_COLUMN = { session: "sessionId", run: "runId", reconstruction: "reconstructionId" } as const;

/**
 * Creates a link share (returns the token once; only its hash is kept) or a guest share (then
 * e-mails the guest, after the commit). The item must belong to the lab (404 otherwise).
 */
export async function createShare(user: AuthUser, labId: string, input: CreateShare): Promise<ShareWithTitle & { token: string | null; mail: MailReport | null }> {
  const expiresAt = checkExpiry(input.expiresAt);
  const email = input.kind === "guest" ? input.email.toLowerCase() : null;
  const { share, token, itemTitle, snapshot } = await db().transaction(async (em) => {
    const snapshot = await loadSnapshotData(labId, input.itemType, input.itemId, em);
    if (email) await refuseDuplicateGuest(em, labId, input.itemType, input.itemId, email);
    const link = input.kind === "link" ? newLinkToken() : null;
    const saved = await em.save(
      em.create(Share, {
        labId,
        kind: input.kind,
        itemType: input.itemType,
        [ITEM_COLUMN[input.itemType]]: input.itemId,
        tokenSha256: link?.sha256 ?? null,
        email,
        label: input.label,
        expiresAt,
        createdById: user.id,
      }),
    );
    await recordAudit(em, user, { labId, action: "share.create", entityType: "share", entityId: saved.id, changes: { kind: input.kind, itemType: input.itemType, itemId: input.itemId, email, expiresAt: expiresAt?.toISOString() ?? null } });
    const share = await em.findOneOrFail(Share, { where: { id: saved.id }, relations: { createdBy: true, revokedBy: true } });
    const itemTitle = (await itemTitles([{ itemType: input.itemType, itemId: input.itemId }], em)).get(input.itemId)!;
    return { share, token: link?.token ?? null, itemTitle, snapshot };
  });
  const mail = email ? await sendMail(guestShareMail(email, snapshot, itemTitle, user.displayName, share, input.kind === "guest" ? input.message : "")) : null;
  return { share, itemTitle, token, mail };
}

function checkExpiry(expiresAt: string | null): Date | null {
  if (!expiresAt) return null;
  const at = new Date(expiresAt);
  if (at.getTime() <= Date.now()) throw invalid("expiresAt", "The expiry must be in the future.");
  if (at.getTime() > Date.now() + SHARE_MAX_DAYS * 86_400_000) throw invalid("expiresAt", `A share can stay open for at most ${SHARE_MAX_DAYS} days; share again after that.`);
  return at;
}

async function refuseDuplicateGuest(em: EntityManager, labId: string, itemType: CreateShare["itemType"], itemId: string, email: string): Promise<void> {
  const member = await em.createQueryBuilder(LabMembership, "m").innerJoin(User, "u", "u.id = m.user_id").where("m.lab_id = :labId AND u.email = :email", { labId, email }).getExists();
  if (member) throw conflict(`${email} is a member of this lab and already sees everything in it.`, [{ field: "email", message: "This person is a member of the lab already." }]);
  const open = await em.find(Share, { where: { labId, kind: "guest", email, itemType, [ITEM_COLUMN[itemType]]: itemId } });
  if (open.some((s) => shareStatus(s) === "active")) throw conflict(`This item is already shared with ${email}.`, [{ field: "email", message: "Already shared with this address; revoke that share first to send a new invitation." }]);
}

/** The lab's shares (optionally of one item), newest first, with the items' names. */
export async function listShares(labId: string, query: ShareListQuery): Promise<ShareWithTitle[]> {
  const where: Record<string, string> = { labId };
  if (query.itemType) where.itemType = query.itemType;
  if (query.itemType && query.itemId) where[ITEM_COLUMN[query.itemType]] = query.itemId;
  const shares = await db().manager.find(Share, { where, relations: { createdBy: true, revokedBy: true }, order: { createdAt: "DESC", id: "DESC" } });
  return withTitles(shares);
}

async function withTitles(shares: Share[]): Promise<ShareWithTitle[]> {
  const titles = await itemTitles(shares.map((s) => ({ itemType: s.itemType, itemId: shareItemId(s) })));
  return shares.map((share) => ({ share, itemTitle: titles.get(shareItemId(share)) ?? "(removed)" }));
}

/** Closes a share for good (idempotent: revoking a revoked share changes nothing). */
export async function revokeShare(user: AuthUser, labId: string, shareId: string): Promise<ShareWithTitle> {
  return db().transaction(async (em) => {
    const share = await em.findOne(Share, { where: { id: shareId, labId }, lock: { mode: "pessimistic_write" } });
    if (!share) throw notFound("Share");
    if (!share.revokedAt) {
      await em.update(Share, { id: shareId }, { revokedAt: new Date(), revokedById: user.id });
      await recordAudit(em, user, { labId, action: "share.revoke", entityType: "share", entityId: shareId, changes: { kind: share.kind, itemType: share.itemType, email: share.email } });
    }
    const fresh = await em.findOneOrFail(Share, { where: { id: shareId }, relations: { createdBy: true, revokedBy: true } });
    return { share: fresh, itemTitle: (await itemTitles([{ itemType: fresh.itemType, itemId: shareItemId(fresh) }], em)).get(shareItemId(fresh)) ?? "(removed)" };
  });
}

/** Opens a link share: 404 for an unknown token, 410 when expired or revoked. */
export async function openLinkShare(token: string): Promise<{ share: Share; data: SnapshotData }> {
  const share = await db().manager.findOneBy(Share, { tokenSha256: hashLinkToken(token), kind: "link" });
  if (!share) throw notFound("Share link");
  return open(share);
}

/** Opens a guest share for the signed-in guest: 404 unless it is theirs, 410 when closed. */
export async function openGuestShare(user: AuthUser, shareId: string): Promise<{ share: Share; data: SnapshotData }> {
  const share = await db().manager.findOneBy(Share, { id: shareId });
  assertGuestOf(user, share);
  return open(share);
}

async function open(share: Share): Promise<{ share: Share; data: SnapshotData }> {
  assertShareOpen(share);
  const data = await loadSnapshotData(share.labId, share.itemType, shareItemId(share));
  await db().query(`UPDATE shares SET open_count = open_count + 1, last_opened_at = clock_timestamp() WHERE id = $1`, [share.id]);
  return { share, data };
}

/** Everything shared with the signed-in person's address, newest first. */
export async function listGuestShares(user: AuthUser): Promise<ShareWithTitle[]> {
  const shares = await db().manager.find(Share, { where: { kind: "guest", email: user.email.toLowerCase() }, relations: { lab: true, createdBy: true }, order: { createdAt: "DESC" } });
  return withTitles(shares);
}
