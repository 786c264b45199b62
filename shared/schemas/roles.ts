import { z } from "zod";

/** Roles inside a lab: owner (members, roles, deletion), member (creates and edits), viewer (reads). */
export const LabRoleSchema = z.enum(["owner", "member", "viewer"]);
export type LabRole = z.infer<typeof LabRoleSchema>;
