import type { LabRole } from "@shared/schemas/roles";
import type { AuthUser } from "../http/auth";
import { authorizeLab } from "./labAccess";

/** Sources of a lab: every member reads them; members and owners add and edit them. */
export const sourcePolicy = {
  view: (user: AuthUser, labId: string): Promise<LabRole> => authorizeLab(user, labId, "read"),
  create: (user: AuthUser, labId: string): Promise<LabRole> => authorizeLab(user, labId, "write"),
  edit: (user: AuthUser, labId: string): Promise<LabRole> => authorizeLab(user, labId, "write"),
};
