import type { LabRole } from "@shared/schemas/roles";
import type { AuthUser } from "../http/auth";
import { authorizeLab } from "./labAccess";

/** Lab sessions (setups and their days): read by the whole lab, written by members and owners. */
export const labSessionPolicy = {
  view: (user: AuthUser, labId: string): Promise<LabRole> => authorizeLab(user, labId, "read"),
  create: (user: AuthUser, labId: string): Promise<LabRole> => authorizeLab(user, labId, "write"),
  edit: (user: AuthUser, labId: string): Promise<LabRole> => authorizeLab(user, labId, "write"),
};
