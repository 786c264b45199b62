/**
 * The demo scenario's notebook (invented data): source "Sagnac-2" and lab sessions 1, 2, 5 and 6
 * with their runs and reconstructions. Counts are drawn with Poisson noise from known states by
 * the engine's simulateCounts with fixed seeds, so every run of the seed gives the same numbers.
 * Sessions 3 (Bell test) and 4 (fringe scans) are seeded separately. Idempotent: an existing
 * source, session or run (matched by name) is left alone.
 */
import type { EntityManager } from "typeorm";
import { simulateCounts, standardSet, type CountsRow, type DensityMatrix, type SetupConventions, type StandardSetId } from "@shared/physics";
import { CreateLabSessionSchema, type CreateLabSession } from "@shared/schemas/labSessions";
import { CreateRunSchema } from "@shared/schemas/runs";
import { LabSession, Run, Source, type Lab, type User } from "../../entities/index";
import type { AuthUser } from "../../http/auth";
import { recordAudit } from "../../services/audit";
import { computeReconstruction, conventionsOf } from "../../services/engine";
import { computeOnSave, saveReconstructions, storeRun } from "../../services/runs";
import { wernerLike } from "./demoStates";

export const DEMO_SOURCE = {
  name: "Sagnac-2",
  crystal: "type-II periodically poled KTP in a polarization Sagnac loop",
  pumpLaser: "405 nm continuous-wave diode laser (class 3B)",
  wavelengthNm: 810,
  targetState: "psi-" as const,
  notes: "Invented demo source. Pairs at 810 nm close to ψ⁻ = (|HV⟩ − |VH⟩)/√2.",
};

const WINDOW_NS = 3;
/** Detected pairs and singles per second per mW of pump (invented; chosen so that the 20 mW point loses ≈ 0.05 of fidelity to accidentals). */
const PAIRS_PER_MW = 2500;
const SINGLES_PER_MW = 26_600;

interface DemoRun {
  name: string;
  set: StandardSetId;
  rho: DensityMatrix;
  pumpMw: number;
  seconds: number;
  conditions?: { compensatorTiltDeg?: number };
  notes?: string;
  /** Also store an MLE with accidentals subtracted. */
  withSubtraction?: boolean;
}

interface DemoSession {
  setup: Omit<CreateLabSession, "sourceId">;
  author: string;
  runs: DemoRun[];
}

const setup = (s: Partial<CreateLabSession> & Pick<CreateLabSession, "title" | "date">) =>
  CreateLabSessionSchema.omit({ sourceId: true }).parse({
    people: ["Student", "Lab member"],
    pumpWavelengthNm: 405,
    crystalTemperatureC: 31.2,
    coincidenceWindowNs: WINDOW_NS,
    detectors: "Silicon avalanche photodiodes, one per PBS port used",
    ...s,
  });

const DEG = Math.PI / 180;

export const DEMO_SESSIONS: DemoSession[] = [
  {
    author: "student@larkspur.example",
    setup: setup({
      title: "1 · Pump power sweep",
      date: "2026-01-13",
      notes: "16-setting tomography at 1, 2, 5, 10 and 20 mW. Accidentals grow with the square of the pump power; compare the reconstructions with and without accidental subtraction.",
    }),
    runs: [1, 2, 5, 10, 20].map((p) => ({ name: `${p} mW`, set: "tomo16" as const, rho: wernerLike(0.98), pumpMw: p, seconds: 10, withSubtraction: true })),
  },
  {
    author: "member@larkspur.example",
    setup: setup({
      title: "2 · Phase compensation",
      date: "2026-01-20",
      pumpPowerMw: 5,
      notes: "Tilting the compensation plate changes φ in (|HV⟩ + e^{iφ}|VH⟩)/√2: fidelity to ψ⁻ swings while the phase-optimised fidelity stays high.",
    }),
    // φ = 180° + 40° per degree of tilt away from 3°: ψ⁻ at 3°.
    runs: [0, 1.5, 3, 4.5, 6].map((tilt) => ({ name: `tilt ${tilt}°`, set: "tomo16" as const, rho: wernerLike(0.97, (180 + 40 * (tilt - 3)) * DEG), pumpMw: 5, seconds: 5, conditions: { compensatorTiltDeg: tilt } })),
  },
  {
    author: "student@larkspur.example",
    setup: setup({
      title: "5 · A bad day",
      date: "2026-02-10",
      pumpPowerMw: 5,
      notes: "The loop was misaligned after the building's power cut: the first run is strongly mixed. An upload of a hand-edited file was refused (a counts cell read “12x”); nothing of it was stored. Realigned in the afternoon.",
    }),
    runs: [
      { name: "misaligned", set: "tomo16", rho: wernerLike(0.35), pumpMw: 5, seconds: 5, notes: "Mixed state, concurrence near 0: the loop's two directions no longer overlap." },
      { name: "after realignment", set: "tomo16", rho: wernerLike(0.96), pumpMw: 5, seconds: 5 },
    ],
  },
  {
    author: "member@larkspur.example",
    setup: setup({
      title: "6 · Overcomplete check",
      date: "2026-02-17",
      pumpPowerMw: 5,
      calibration: [
        { qwp: { fastAxisOffsetDeg: 1.5, retardanceErrorDeg: -3 }, hwp: { fastAxisOffsetDeg: 0.8, retardanceErrorDeg: 2 } },
        { qwp: { fastAxisOffsetDeg: -1.2, retardanceErrorDeg: 0 }, hwp: { fastAxisOffsetDeg: 0, retardanceErrorDeg: -4 } },
      ],
      notes: "Waveplates calibrated the day before (offsets and retardance errors above). One run with all 36 settings, one with the 16 standard settings; both reconstructed with the calibrated projectors.",
    }),
    runs: [
      { name: "36 settings", set: "tomo36", rho: wernerLike(0.97), pumpMw: 5, seconds: 5 },
      { name: "16 settings, calibrated plates", set: "tomo16", rho: wernerLike(0.97), pumpMw: 5, seconds: 5 },
    ],
  },
];

/** Fixed seeds: simulation and Monte Carlo of demo run k. */
const simulationSeed = (session: number, run: number) => 20_260_113 + 100 * session + run;

export async function seedDemoNotebook(em: EntityManager, lab: Lab, users: Map<string, User>): Promise<{ runsAdded: number }> {
  const owner = asAuthUser(users.get("owner@larkspur.example")!);
  let source = await em.findOneBy(Source, { labId: lab.id, name: DEMO_SOURCE.name });
  if (!source) {
    source = await em.save(em.create(Source, { ...DEMO_SOURCE, labId: lab.id, createdById: owner.id }));
    await recordAudit(em, owner, { labId: lab.id, action: "source.create", entityType: "source", entityId: source.id, changes: { name: source.name, seed: true } });
  }
  let runsAdded = 0;
  for (const [s, spec] of DEMO_SESSIONS.entries()) {
    const author = asAuthUser(users.get(spec.author)!);
    let labSession = await em.findOne(LabSession, { where: { labId: lab.id, sourceId: source.id, title: spec.setup.title }, relations: { source: true } });
    if (!labSession) {
      const { id } = await em.save(em.create(LabSession, { ...spec.setup, sourceId: source.id, labId: lab.id, createdById: author.id }));
      await recordAudit(em, author, { labId: lab.id, action: "labSession.create", entityType: "labSession", entityId: id, changes: { title: spec.setup.title, seed: true } });
      labSession = await em.findOneOrFail(LabSession, { where: { id }, relations: { source: true } });
    }
    for (const [r, demo] of spec.runs.entries()) {
      if (await em.existsBy(Run, { sessionId: labSession.id, name: demo.name })) continue;
      await seedRun(em, author, labSession, demo, simulationSeed(s, r));
      runsAdded++;
    }
  }
  return { runsAdded };
}

async function seedRun(em: EntityManager, author: AuthUser, labSession: LabSession, demo: DemoRun, seed: number): Promise<void> {
  const conventions = conventionsOf(labSession, demo.set) as SetupConventions;
  const simulated = simulateCounts({
    rho: demo.rho,
    settings: standardSet(demo.set).labels,
    pairRate: PAIRS_PER_MW * demo.pumpMw,
    seconds: demo.seconds,
    seed,
    conventions,
    singles: { rateA: SINGLES_PER_MW * demo.pumpMw, rateB: SINGLES_PER_MW * demo.pumpMw, windowNs: WINDOW_NS },
  });
  const input = CreateRunSchema.parse({
    settingSetId: demo.set,
    name: demo.name,
    notes: demo.notes ?? "",
    conditions: { pumpPowerMw: demo.pumpMw, ...demo.conditions },
    rows: simulated.map(rowOf),
  });
  const computed = await computeOnSave(labSession, input.settingSetId, input.rows, input.reconstruction, "reconstruction.corrections", seed);
  const { id, revisionId } = await storeRun(em, author, labSession, input, computed);
  if (!demo.withSubtraction) return;
  const subtracted = await computeReconstruction({
    rows: input.rows,
    settingSetId: input.settingSetId,
    labSession,
    target: labSession.source!.targetState,
    method: "mle",
    corrections: { accidentals: true, windowNs: null, efficiencies: null, drift: "none" },
    samples: input.reconstruction.monteCarloSamples,
    seed,
    fieldPrefix: "corrections",
  });
  const [saved] = await saveReconstructions(em, author, { id, labId: labSession.labId }, { id: revisionId }, [subtracted]);
  await recordAudit(em, author, { labId: labSession.labId, action: "reconstruction.create", entityType: "reconstruction", entityId: saved.id, changes: { runId: id, method: "mle", corrections: subtracted.corrections, seed: true } });
}

function rowOf(r: CountsRow) {
  return { setting: r.setting, counts: r.counts, seconds: r.seconds ?? 1, singlesA: r.singlesA ?? null, singlesB: r.singlesB ?? null };
}

function asAuthUser(u: User): AuthUser {
  return { id: u.id, email: u.email, displayName: u.displayName };
}
