import bcrypt from "bcryptjs";
import type { EntityManager } from "typeorm";
import type { LabRole } from "@shared/schemas/roles";
import { Lab, LabMembership, User } from "../../entities/index";

/** Demo sign-ins of the invented Larkspur Institute lab; the start command prints them. */
export const DEMO_PASSWORD = process.env.RHOMB_DEMO_PASSWORD ?? "larkspur-photons";

export const DEMO_LAB = { name: "Quantum Light Group", institution: "Larkspur Institute (fictional)" };

export const DEMO_ACCOUNTS: Array<{ email: string; displayName: string; role: LabRole | null; what: string }> = [
  { email: "owner@larkspur.example", displayName: "Lab owner", role: "owner", what: "lab owner: members, roles, review" },
  { email: "member@larkspur.example", displayName: "Lab member", role: "member", what: "member: batch uploads, reconstructions" },
  { email: "student@larkspur.example", displayName: "Student", role: "member", what: "student: enters counts by hand" },
  { email: "guest@partner.example", displayName: "Partner collaborator", role: null, what: "collaborator: sees only what is shared" },
];

/** Idempotent: creates what is missing, never touches what exists. Returns the demo lab. */
export async function seedDemoAccounts(em: EntityManager): Promise<{ lab: Lab; users: Map<string, User> }> {
  const hash = await bcrypt.hash(DEMO_PASSWORD, 10);
  const users = new Map<string, User>();
  for (const account of DEMO_ACCOUNTS) {
    let user = await em.findOneBy(User, { email: account.email });
    if (!user) {
      user = await em.save(em.create(User, { email: account.email, displayName: account.displayName, passwordHash: hash, emailVerifiedAt: new Date() }));
    }
    users.set(account.email, user);
  }
  const owner = users.get("owner@larkspur.example")!;
  let lab = await em.findOneBy(Lab, { name: DEMO_LAB.name, createdById: owner.id });
  if (!lab) lab = await em.save(em.create(Lab, { ...DEMO_LAB, createdById: owner.id }));
  for (const account of DEMO_ACCOUNTS) {
    if (!account.role) continue;
    const userId = users.get(account.email)!.id;
    const exists = await em.findOneBy(LabMembership, { labId: lab.id, userId });
    if (!exists) await em.save(em.create(LabMembership, { labId: lab.id, userId, role: account.role }));
  }
  return { lab, users };
}
