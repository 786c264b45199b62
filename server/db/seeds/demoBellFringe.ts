/**
 * Sessions 3 (Bell test) and 4 (fringe scans) of the demo scenario (invented data), on the
 * notebook seed's source "Sagnac-2". The state is Bell-diagonal with t = (−0.95, −0.95, −0.98):
 * fidelity 0.97 to ψ⁻, S = √2(t_x + t_z) ≈ −2.73 at the standard angles (|S| ≈ 2.7 once the
 * accidentals are in), visibilities |t_z| = 0.98 with arm A at H and |t_x| = 0.95 at D. Counts are
 * Poisson draws by the engine's simulateCounts with fixed seeds. Idempotent like the notebook
 * seed: an existing session or run (matched by title or name) is left alone.
 */
import type { EntityManager } from "typeorm";
import { simulateCounts, standardSet, type CountsRow } from "@shared/physics";
import { STANDARD_BELL_ANGLES, bellDiagonalState, bellTestSettings, fringeScanSettings } from "@shared/physics/bell";
import { CreateLabSessionSchema } from "@shared/schemas/labSessions";
import { CreateRunSchema, type CreateRun } from "@shared/schemas/runs";
import { LabSession, Run, Source, type Lab, type User } from "../../entities/index";
import type { AuthUser } from "../../http/auth";
import { recordAudit } from "../../services/audit";
import { computeOnSave, storeRun } from "../../services/runs";
import { DEMO_SOURCE } from "./demoNotebook";

const RHO = bellDiagonalState(-0.95, -0.95, -0.98);
const WINDOW_NS = 3;
/** Same invented source brightness as the notebook seed's sessions. */
const PAIRS_PER_MW = 2500;
const SINGLES_PER_MW = 26_600;
const SCAN_DEG = Array.from({ length: 18 }, (_, i) => i * 10);

interface DemoRun {
  name: string;
  kind: CreateRun["kind"];
  settings: CountsRow["setting"][];
  pumpMw: number;
  seconds: number;
  notes: string;
}

const SESSIONS: { title: string; date: string; pumpMw: number; notes: string; author: string; runs: DemoRun[] }[] = [
  {
    title: "3 · Bell test",
    date: "2026-01-27",
    pumpMw: 5,
    author: "member@larkspur.example",
    notes: "CHSH at the standard angles a = 0°, a′ = 45°, b = 22.5°, b′ = 67.5° (linear analysers: QWP at θ, HWP at θ/2), with a 16-setting tomography just before for comparison.",
    runs: [
      { name: "Tomography before the Bell test", kind: "tomography", settings: standardSet("tomo16").labels, pumpMw: 5, seconds: 5, notes: "" },
      { name: "CHSH, standard angles", kind: "bell", settings: bellTestSettings(STANDARD_BELL_ANGLES), pumpMw: 5, seconds: 2, notes: "Sixteen settings: each analyser pair and its three orthogonal partners." },
    ],
  },
  {
    title: "4 · Fringe scans",
    date: "2026-02-03",
    pumpMw: 2,
    author: "student@larkspur.example",
    notes: "Arm B's polariser turned in 10° steps with arm A fixed at H, then at D. Choose “accidentals from singles” as background to see the state's own visibilities.",
    runs: [
      { name: "Arm A at H, then at D", kind: "fringe", settings: [...fringeScanSettings(0, SCAN_DEG), ...fringeScanSettings(45, SCAN_DEG)], pumpMw: 2, seconds: 1, notes: "" },
    ],
  },
];

const simulationSeed = (session: number, run: number) => 20_260_127 + 100 * session + run;

export async function seedDemoBellFringe(em: EntityManager, lab: Lab, users: Map<string, User>): Promise<{ runsAdded: number }> {
  const source = await em.findOneBy(Source, { labId: lab.id, name: DEMO_SOURCE.name });
  if (!source) throw new Error(`the demo source "${DEMO_SOURCE.name}" is missing: seed the notebook first`);
  let runsAdded = 0;
  for (const [s, spec] of SESSIONS.entries()) {
    const author = asAuthUser(users.get(spec.author)!);
    let labSession = await em.findOne(LabSession, { where: { labId: lab.id, sourceId: source.id, title: spec.title }, relations: { source: true } });
    if (!labSession) {
      const setup = CreateLabSessionSchema.omit({ sourceId: true }).parse({
        title: spec.title,
        date: spec.date,
        people: ["Student", "Lab member"],
        pumpWavelengthNm: 405,
        pumpPowerMw: spec.pumpMw,
        crystalTemperatureC: 31.2,
        coincidenceWindowNs: WINDOW_NS,
        detectors: "Silicon avalanche photodiodes, one per PBS port used",
        notes: spec.notes,
      });
      const { id } = await em.save(em.create(LabSession, { ...setup, sourceId: source.id, labId: lab.id, createdById: author.id }));
      await recordAudit(em, author, { labId: lab.id, action: "labSession.create", entityType: "labSession", entityId: id, changes: { title: spec.title, seed: true } });
      labSession = await em.findOneOrFail(LabSession, { where: { id }, relations: { source: true } });
    }
    for (const [r, demo] of spec.runs.entries()) {
      if (await em.existsBy(Run, { sessionId: labSession.id, name: demo.name })) continue;
      const seed = simulationSeed(s, r);
      const singles = SINGLES_PER_MW * demo.pumpMw;
      const simulated = simulateCounts({ rho: RHO, settings: demo.settings, pairRate: PAIRS_PER_MW * demo.pumpMw, seconds: demo.seconds, seed, singles: { rateA: singles, rateB: singles, windowNs: WINDOW_NS } });
      const input = CreateRunSchema.parse({
        kind: demo.kind,
        settingSetId: demo.kind === "tomography" ? "tomo16" : "custom",
        name: demo.name,
        notes: demo.notes,
        conditions: { pumpPowerMw: demo.pumpMw },
        rows: simulated.map((row) => ({ setting: row.setting, counts: row.counts, seconds: row.seconds ?? 1, singlesA: row.singlesA ?? null, singlesB: row.singlesB ?? null })),
      });
      const computed = demo.kind === "tomography" ? await computeOnSave(labSession, input.settingSetId, input.rows, input.reconstruction, "reconstruction.corrections", seed) : [];
      await storeRun(em, author, labSession, input, computed);
      runsAdded++;
    }
  }
  return { runsAdded };
}

function asAuthUser(u: User): AuthUser {
  return { id: u.id, email: u.email, displayName: u.displayName };
}
