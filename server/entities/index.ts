import { Lab } from "./Lab";
import { LabMembership } from "./LabMembership";
import { User } from "./User";

/** Every entity, listed explicitly (no globs: tsx and vitest load files differently). */
export const entities = [User, Lab, LabMembership];

export { Lab, LabMembership, User };
