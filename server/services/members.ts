import type { EntityManager } from "typeorm";
import type { LabRole } from "@shared/schemas/roles";
import { db } from "../db/dataSource";
import { Lab } from "../entities/Lab";
import { LabMembership } from "../entities/LabMembership";
import { HttpError, notFound } from "../http/errors";

/** Members of one lab with their accounts, owners first, then by name. */
export async function listMembers(labId: string): Promise<LabMembership[]> {
  const rows = await db().getRepository(LabMembership).find({ where: { labId }, relations: { user: true } });
  const rank: Record<LabRole, number> = { owner: 0, member: 1, viewer: 2 };
  return rows.sort((a, b) => rank[a.role] - rank[b.role] || a.user!.displayName.localeCompare(b.user!.displayName));
}

const lastOwner = () =>
  new HttpError(409, "last_owner", "A lab always needs at least one owner. Make someone else an owner first (or delete the lab).");

/**
 * Locks the lab row, so two owners demoting or removing each other at the same moment cannot
 * both succeed and leave the lab without an owner.
 */
async function lockedMembership(em: EntityManager, labId: string, userId: string): Promise<LabMembership> {
  await em.createQueryBuilder(Lab, "lab").setLock("pessimistic_write").where("lab.id = :labId", { labId }).getOne();
  const m = await em.findOne(LabMembership, { where: { labId, userId }, relations: { user: true } });
  if (!m) throw notFound("Member");
  return m;
}

async function otherOwners(em: EntityManager, labId: string, userId: string): Promise<number> {
  return em.createQueryBuilder(LabMembership, "m").where("m.lab_id = :labId AND m.role = 'owner' AND m.user_id <> :userId", { labId, userId }).getCount();
}

export async function changeRole(labId: string, userId: string, role: LabRole): Promise<LabMembership> {
  return db().transaction(async (em) => {
    const m = await lockedMembership(em, labId, userId);
    if (m.role === "owner" && role !== "owner" && (await otherOwners(em, labId, userId)) === 0) throw lastOwner();
    m.role = role;
    await em.update(LabMembership, { labId, userId }, { role });
    return m;
  });
}

export async function removeMember(labId: string, userId: string): Promise<void> {
  await db().transaction(async (em) => {
    const m = await lockedMembership(em, labId, userId);
    if (m.role === "owner" && (await otherOwners(em, labId, userId)) === 0) throw lastOwner();
    await em.delete(LabMembership, { labId, userId });
  });
}
