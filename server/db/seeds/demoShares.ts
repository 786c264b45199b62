import type { EntityManager } from "typeorm";
import { Lab, Share, User } from "../../entities/index";
import { DEMO_LAB } from "./demoAccounts";

const GUEST = "guest@partner.example";

/**
 * One run of the demo lab shared with the demo collaborator (guest@partner.example), so that
 * account has something to open under "Shared with me". Runs after the notebook seed; does
 * nothing while the lab has no tomography run, and nothing if the guest already has a share.
 */
export async function seedDemoShares(em: EntityManager): Promise<void> {
  const owner = await em.findOneBy(User, { email: "owner@larkspur.example" });
  const lab = owner && (await em.findOneBy(Lab, { name: DEMO_LAB.name, createdById: owner.id }));
  if (!owner || !lab) return;
  if (await em.existsBy(Share, { labId: lab.id, kind: "guest", email: GUEST })) return;
  // Prefer a run of the pump-power sweep (the scenario's headline session), else any tomography run.
  const [run] = await em.query(
    `SELECT r.id FROM runs r JOIN lab_sessions ls ON ls.id = r.session_id
     WHERE r.lab_id = $1 AND r.kind = 'tomography'
     ORDER BY (ls.title ILIKE '%pump power%') DESC, r.created_at ASC LIMIT 1`,
    [lab.id],
  );
  if (!run) return;
  await em.save(em.create(Share, { labId: lab.id, kind: "guest", itemType: "run", runId: run.id, email: GUEST, label: "Demo: shared with the partner group", createdById: owner.id }));
}
