import type { CreateLab, UpdateLab } from "@shared/schemas/labs";
import type { LabRole } from "@shared/schemas/roles";
import { db } from "../db/dataSource";
import { Lab } from "../entities/Lab";
import { LabMembership } from "../entities/LabMembership";
import type { AuthUser } from "../http/auth";

/** The labs the user belongs to, with their role in each, oldest membership first. */
export async function listLabsOf(user: AuthUser): Promise<Array<{ lab: Lab; role: LabRole }>> {
  const rows = await db()
    .getRepository(LabMembership)
    .find({ where: { userId: user.id, ...(user.token ? { labId: user.token.labId } : {}) }, relations: { lab: true }, order: { createdAt: "ASC" } });
  return rows.map((m) => ({ lab: m.lab!, role: m.role }));
}

/** Creates a lab with its creator as owner, in one transaction. */
export async function createLab(user: AuthUser, input: CreateLab): Promise<Lab> {
  return db().transaction(async (em) => {
    const lab = await em.save(em.create(Lab, { name: input.name, institution: input.institution, createdById: user.id }));
    await em.save(em.create(LabMembership, { labId: lab.id, userId: user.id, role: "owner" }));
    return lab;
  });
}

export async function updateLab(labId: string, input: UpdateLab): Promise<Lab> {
  return db().transaction(async (em) => {
    const lab = await em.findOneByOrFail(Lab, { id: labId });
    if (input.name !== undefined) lab.name = input.name;
    if (input.institution !== undefined) lab.institution = input.institution;
    return em.save(lab);
  });
}

/** Deletes the lab and, through ON DELETE CASCADE, everything in it. */
export async function deleteLab(labId: string): Promise<void> {
  await db().transaction(async (em) => {
    await em.delete(Lab, { id: labId });
  });
}
