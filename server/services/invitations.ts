import { IsNull, type EntityManager } from "typeorm";
import { INVITATION_DAYS, type AcceptInvitation, type CreateInvitation } from "@shared/schemas/invitations";
import type { LabRole } from "@shared/schemas/roles";
import { db } from "../db/dataSource";
import { Invitation } from "../entities/Invitation";
import { Lab } from "../entities/Lab";
import { LabMembership } from "../entities/LabMembership";
import { User } from "../entities/User";
import type { AuthUser } from "../http/auth";
import { HttpError, conflict, gone, invalid, notFound } from "../http/errors";
import { sendMail, type MailReport } from "../mail/mailer";
import { invitationMail } from "../mail/templates";
import { hashLinkToken, hoursFromNow, newLinkToken } from "./linkTokens";
import { hashPassword } from "./passwords";

const open = { acceptedAt: IsNull(), revokedAt: IsNull() };

/** Stores the invitation (replacing an open one to the same address), then e-mails the link. */
export async function createInvitation(actor: AuthUser, labId: string, input: CreateInvitation): Promise<{ invitation: Invitation; mail: MailReport }> {
  const email = input.email.toLowerCase();
  const { invitation, token, lab } = await db().transaction(async (em) => {
    const lab = await em.findOneByOrFail(Lab, { id: labId });
    const existing = await em.findOneBy(User, { email });
    if (existing && (await em.existsBy(LabMembership, { labId, userId: existing.id }))) {
      throw conflict(`${email} is already a member of this lab.`, [{ field: "email", message: "This person is already a member of this lab; change their role in the list instead." }]);
    }
    await em.update(Invitation, { labId, email, ...open }, { revokedAt: new Date() });
    const { token, sha256 } = newLinkToken();
    const saved = await em.save(em.create(Invitation, { labId, email, role: input.role, tokenSha256: sha256, invitedById: actor.id, expiresAt: hoursFromNow(INVITATION_DAYS * 24) }));
    const invitation = await em.findOneOrFail(Invitation, { where: { id: saved.id }, relations: { invitedBy: true } });
    return { invitation, token, lab };
  });
  const mail = await sendMail(invitationMail(email, lab, actor.displayName, input.role, token, INVITATION_DAYS));
  return { invitation, mail };
}

/** Open invitations of a lab (pending or expired), newest first. */
export function listInvitations(labId: string): Promise<Invitation[]> {
  return db().getRepository(Invitation).find({ where: { labId, ...open }, relations: { invitedBy: true }, order: { createdAt: "DESC" } });
}

export async function revokeInvitation(labId: string, invitationId: string): Promise<void> {
  const result = await db().getRepository(Invitation).update({ id: invitationId, labId, ...open }, { revokedAt: new Date() });
  if (!result.affected) throw notFound("Invitation");
}

/** The invitation behind a link, if it can still be accepted; 404 unknown, 410 used/withdrawn/expired. */
export async function findUsableInvitation(token: string, em: EntityManager = db().manager, lock = false): Promise<Invitation> {
  const inv = await em.findOne(Invitation, {
    where: { tokenSha256: hashLinkToken(token) },
    ...(lock ? { lock: { mode: "pessimistic_write" as const } } : {}),
  });
  if (!inv) throw new HttpError(404, "not_found", "This invitation link is not valid: copy the whole link from the e-mail, or ask the lab's owner to invite you again.");
  if (inv.acceptedAt) throw gone("This invitation was already used. If you accepted it, sign in; otherwise ask the lab's owner for a new one.");
  if (inv.revokedAt) throw gone("This invitation was withdrawn by the lab's owner. Ask them for a new one if you still need access.");
  if (inv.expiresAt.getTime() < Date.now()) throw gone(`This invitation expired on ${inv.expiresAt.toUTCString()} (invitations last ${INVITATION_DAYS} days). Ask the lab's owner to send a new one.`);
  inv.lab = await em.findOneByOrFail(Lab, { id: inv.labId });
  inv.invitedBy = inv.invitedById ? await em.findOneBy(User, { id: inv.invitedById }) : null;
  return inv;
}

export async function previewInvitation(token: string): Promise<{ invitation: Invitation; accountExists: boolean }> {
  const invitation = await findUsableInvitation(token);
  return { invitation, accountExists: await db().getRepository(User).existsBy({ email: invitation.email }) };
}

/**
 * Uses up the invitation: a signed-in caller gets the lab added to their account; otherwise an
 * account is created for the invited address (confirmed, since the link arrived there). All in
 * one transaction, with the invitation row locked so a link works exactly once.
 */
export async function acceptInvitation(caller: AuthUser | undefined, input: AcceptInvitation): Promise<{ lab: Lab; role: LabRole; userId: string; created: boolean }> {
  const passwordHash = !caller && input.password ? await hashPassword(input.password) : undefined;
  return db().transaction(async (em) => {
    const inv = await findUsableInvitation(input.token, em, true);
    let userId = caller?.id;
    if (!userId) {
      if (await em.existsBy(User, { email: inv.email })) {
        throw new HttpError(409, "account_exists", `An account for ${inv.email} already exists. Sign in, then open the invitation link again.`, [
          { field: "email", message: "An account with this e-mail already exists: sign in first." },
        ]);
      }
      if (!input.displayName) throw invalid("displayName", "Enter your name as colleagues should see it.");
      if (!passwordHash) throw invalid("password", "Choose a password for your new account.");
      const user = await em.save(em.create(User, { email: inv.email, displayName: input.displayName, passwordHash, emailVerifiedAt: new Date() }));
      userId = user.id;
    } else if (await em.existsBy(LabMembership, { labId: inv.labId, userId })) {
      throw conflict(`You are already a member of ${inv.lab!.name}; this invitation was not used.`);
    }
    await em.save(em.create(LabMembership, { labId: inv.labId, userId, role: inv.role }));
    await em.update(Invitation, { id: inv.id }, { acceptedAt: new Date(), acceptedById: userId });
    return { lab: inv.lab!, role: inv.role, userId, created: !caller };
  });
}
