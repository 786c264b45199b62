import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { simulateCounts, standardSet } from "@shared/physics";
import { LabHomeSchema } from "@shared/schemas/labHome";
import { RunPageSchema } from "@shared/schemas/runs";
import { LabSession, Reconstruction, Run, RunRevision, Source } from "../../server/entities/index";
import { seedDemoAccounts, DEMO_PASSWORD } from "../../server/db/seeds/demoAccounts";
import { DEMO_SESSIONS, seedDemoNotebook } from "../../server/db/seeds/demoNotebook";
import { wernerLike } from "../../server/db/seeds/demoStates";
import { TestClient } from "../support/clients";
import { startTestApp, type TestApp } from "../support/testApp";

/**
 * The demo notebook seed (invented data, see server/db/seeds/demoNotebook.ts). Expected values
 * come from the states it draws from: Werner states p·ψ⁻ + (1−p)·I/4 with F(ψ⁻) = (1 + 3p)/4 and
 * C = max(0, (3p − 1)/2) (Werner, Phys. Rev. A 40, 4277 (1989); physics contract §6); accidental
 * coincidences, uniform over the settings, pull the fidelity towards 1/4 in proportion to their
 * share of the counts (common practice, no source).
 */
describe("demo notebook seed", () => {
  let t: TestApp;
  let client: TestClient;
  let labId: string;
  let first: { runsAdded: number };
  let again: { runsAdded: number };
  let counts: () => Promise<number[]>;
  beforeAll(async () => {
    t = await startTestApp();
    counts = async () => [await t.dataSource.getRepository(Source).count(), await t.dataSource.getRepository(LabSession).count(), await t.dataSource.getRepository(Run).count(), await t.dataSource.getRepository(Reconstruction).count()];
    first = await t.dataSource.transaction(async (em) => {
      const { lab, users } = await seedDemoAccounts(em);
      labId = lab.id;
      return seedDemoNotebook(em, lab, users);
    });
    const before = await counts();
    again = await t.dataSource.transaction(async (em) => {
      const { lab, users } = await seedDemoAccounts(em);
      return seedDemoNotebook(em, lab, users);
    });
    expect(await counts()).toEqual(before);
    client = new TestClient(t);
    await client.signIn("owner@larkspur.example", DEMO_PASSWORD);
  }, 120_000);
  afterAll(() => t.close());

  const runsOf = async (title: string) => {
    const session = await t.dataSource.getRepository(LabSession).findOneByOrFail({ labId, title });
    return RunPageSchema.parse((await client.get(`/api/labs/${labId}/runs?sessionId=${session.id}&sort=createdAt&order=asc`).expect(200)).body).data;
  };
  const mleOf = async (runId: string, accidentals: boolean) =>
    (await t.dataSource.getRepository(Reconstruction).findBy({ runId, method: "mle" })).find((r) => r.corrections.accidentals === accidentals)!;

  it("is idempotent: a second run adds nothing", () => {
    expect(first.runsAdded).toBe(DEMO_SESSIONS.reduce((n, s) => n + s.runs.length, 0));
    expect(again.runsAdded).toBe(0);
  });

  it("stores counts that the engine reproduces from the fixed seed", async () => {
    const [run] = await runsOf("1 · Pump power sweep");
    const stored = await t.dataSource.getRepository(RunRevision).findOneByOrFail({ runId: run.id, number: 1 });
    const redrawn = simulateCounts({ rho: wernerLike(0.98), settings: standardSet("tomo16").labels, pairRate: 2500, seconds: 10, seed: 20_260_113, singles: { rateA: 26_600, rateB: 26_600, windowNs: 3 } });
    expect(stored.rows.map((r) => r.counts)).toEqual(redrawn.map((r) => r.counts));
  });

  it("pump power sweep: raw fidelity falls from ≈ 0.98 to ≈ 0.94 with the accidentals; subtracted it stays ≈ 0.98", async () => {
    const runs = await runsOf("1 · Pump power sweep");
    expect(runs.map((r) => r.conditions.pumpPowerMw)).toEqual([1, 2, 5, 10, 20]);
    const raw: number[] = [];
    const subtracted: number[] = [];
    for (const r of runs) {
      raw.push((await mleOf(r.id, false)).metrics.fidelityPsiMinus!);
      subtracted.push((await mleOf(r.id, true)).metrics.fidelityPsiMinus!);
    }
    // F(ψ⁻) of the source state is (1 + 3·0.98)/4 = 0.985. At 20 mW accidentals are ≈ 6 % of
    // the counts (2.12·P² against 625·P per setting and second), so F ≈ 0.985 − 0.06·0.735 ≈ 0.94.
    expect(raw[0]).toBeGreaterThan(0.97);
    expect(raw[4]).toBeGreaterThan(0.92);
    expect(raw[4]).toBeLessThan(0.95);
    for (let i = 1; i < raw.length; i++) expect(raw[i]).toBeLessThan(raw[i - 1] + 0.005);
    for (const f of subtracted) expect(Math.abs(f - 0.985)).toBeLessThan(0.015);
  });

  it("phase compensation: fidelity to ψ⁻ swings, the phase-optimised fidelity stays high", async () => {
    const runs = await runsOf("2 · Phase compensation");
    const recs = await Promise.all(runs.map((r) => mleOf(r.id, false)));
    const fid = recs.map((r) => r.metrics.fidelityPsiMinus!);
    // p = 0.97: F = p(1 + cos Δφ)/2 + (1 − p)/4, Δφ = 40°·(tilt − 3°) ⇒ 0.25 at ±120°, 0.9775 at 0°.
    expect(Math.min(...fid)).toBeLessThan(0.3);
    expect(Math.max(...fid)).toBeGreaterThan(0.95);
    for (const r of recs) expect(r.metrics.phaseFidelityPsi!).toBeGreaterThan(0.95);
  });

  it("a bad day: the misaligned run is mixed with concurrence near 0", async () => {
    const [misaligned] = await runsOf("5 · A bad day");
    const mle = await mleOf(misaligned.id, false);
    // p = 0.35: C = (3·0.35 − 1)/2 = 0.025, purity (1 + 3p²)/4 ≈ 0.34.
    expect(mle.metrics.concurrence!).toBeLessThan(0.1);
    expect(mle.metrics.purity!).toBeLessThan(0.45);
  });

  it("overcomplete check: a 36-setting run and calibrated plates recorded with the reconstructions", async () => {
    const runs = await runsOf("6 · Overcomplete check");
    expect(runs.map((r) => [r.settingSetId, r.rowCount])).toEqual([["tomo36", 36], ["tomo16", 16]]);
    const mle = await mleOf(runs[1].id, false);
    expect(mle.conventions.calibration[0].qwp.fastAxisOffsetDeg).toBe(1.5);
    expect(mle.metrics.fidelityPsiMinus!).toBeGreaterThan(0.95);
  });

  it("lab home: best fidelity of Sagnac-2 and recent sessions", async () => {
    const home = LabHomeSchema.parse((await client.get(`/api/labs/${labId}/home`).expect(200)).body);
    expect(home.totals).toMatchObject({ sources: 1, sessions: 4 });
    const best = home.bestBySource.find((b) => b.source.name === "Sagnac-2")!.best!;
    expect(best.fidelity).toBeGreaterThan(0.97);
    expect(best.uncertainty).toBeGreaterThan(0);
    expect(home.recentSessions[0].title).toBe("6 · Overcomplete check");
    expect(home.recentRuns).toHaveLength(8);
  });
});
