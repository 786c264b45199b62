import type { LabRole } from "@shared/schemas/roles";
import type { AuthUser } from "../http/auth";
import { authorizeLab } from "./labAccess";

/**
 * Runs and what hangs off them (revisions, reconstructions, attachments, comparisons).
 * Viewers read everything; members and owners record runs, correct counts (a new revision,
 * never an overwrite) and add reconstructions.
 */
export const runPolicy = {
  view: (user: AuthUser, labId: string): Promise<LabRole> => authorizeLab(user, labId, "read"),
  create: (user: AuthUser, labId: string): Promise<LabRole> => authorizeLab(user, labId, "write"),
  edit: (user: AuthUser, labId: string): Promise<LabRole> => authorizeLab(user, labId, "write"),
  revise: (user: AuthUser, labId: string): Promise<LabRole> => authorizeLab(user, labId, "write"),
  reconstruct: (user: AuthUser, labId: string): Promise<LabRole> => authorizeLab(user, labId, "write"),
};
