import type { EntityManager } from "typeorm";
import type { LabRole } from "@shared/schemas/roles";
import { db } from "../db/dataSource";
import { forbidden, notFound } from "../http/errors";
import type { AuthUser } from "../http/auth";

/**
 * What a role inside a lab allows. Every resource policy is written in these terms:
 *   read   — see the lab's sources, sessions, runs, reconstructions (viewer, member, owner)
 *   write  — create and edit them, and share them (member, owner)
 *   manage — members, roles, invitations, deleting the lab (owner)
 */
export type LabAction = "read" | "write" | "manage";

const ALLOWED: Record<LabRole, ReadonlySet<LabAction>> = {
  viewer: new Set(["read"]),
  member: new Set(["read", "write"]),
  owner: new Set(["read", "write", "manage"]),
};

export function roleAllows(role: LabRole | null | undefined, action: LabAction): boolean {
  return !!role && ALLOWED[role].has(action);
}

/** The caller's allowed actions, returned with each resource so the client hides what it may not do. */
export function allowedActions(role: LabRole | null | undefined): Record<LabAction, boolean> {
  return { read: roleAllows(role, "read"), write: roleAllows(role, "write"), manage: roleAllows(role, "manage") };
}

export async function roleInLab(userId: string, labId: string, em: EntityManager = db().manager): Promise<LabRole | null> {
  // Plain SQL: asked on nearly every request (see loadUser in server/http/auth.ts).
  const [m]: Array<{ role: LabRole }> = await em.query("SELECT role FROM lab_memberships WHERE user_id = $1 AND lab_id = $2", [userId, labId]);
  return m?.role ?? null;
}

/**
 * Asks whether `user` may do `action` in `labId`. Someone outside the lab gets 404 (not 403),
 * so guessing ids reveals nothing; a member without the right gets 403. Returns the role.
 * A personal API token only ever reaches the lab it is scoped to.
 */
export async function authorizeLab(user: AuthUser, labId: string, action: LabAction, em?: EntityManager): Promise<LabRole> {
  if (user.token && user.token.labId !== labId) throw notFound("Lab");
  const role = await roleInLab(user.id, labId, em);
  if (!role) throw notFound("Lab");
  if (!roleAllows(role, action)) {
    throw forbidden(action === "manage" ? "Only the lab's owners can do this." : "Your role in this lab is read-only (viewer).");
  }
  return role;
}

/** Removing someone from a lab: owners may remove anyone; everyone may leave by themselves. */
export function authorizeMemberRemoval(user: AuthUser, labId: string, targetUserId: string): Promise<LabRole> {
  return authorizeLab(user, labId, user.id === targetUserId ? "read" : "manage");
}
