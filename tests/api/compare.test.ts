import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { CompareSchema } from "@shared/schemas/compare";
import { RunDetailSchema, type RunDetailDto } from "@shared/schemas/runs";
import { labWithRoles, type LabFixture } from "../support/clients";
import { psiMinusRows, sessionIn } from "../support/notebook";
import { startTestApp, type TestApp } from "../support/testApp";

/**
 * Two runs of Werner states p·ψ⁻ + (1−p)·I/4 with p = 0.95 and 0.75. Closed forms (Werner, Phys.
 * Rev. A 40, 4277 (1989); physics contract §6): ΔF(ψ⁻) = 3Δp/4 = −0.15, ΔC = 3Δp/2 = −0.3; the
 * states commute, so the trace distance is ½Σ|λᵢ − μᵢ| = ½(|3Δp/4| + 3·|Δp/4|) = 3|Δp|/4 = 0.15
 * (Nielsen & Chuang (2000), §9.2.1).
 */
describe("compare", () => {
  let t: TestApp;
  let f: LabFixture;
  let lab: string;
  let a: RunDetailDto;
  let b: RunDetailDto;
  beforeAll(async () => {
    t = await startTestApp();
    f = await labWithRoles(t);
    lab = f.lab.id;
    const { sessionId } = await sessionIn(f);
    const make = async (p: number, name: string) =>
      RunDetailSchema.parse((await f.clients.member.post(`/api/labs/${lab}/sessions/${sessionId}/runs`, { settingSetId: "tomo16", name, rows: psiMinusRows({ p, pairRate: 100_000, seed: 41 }), reconstruction: { monteCarloSamples: 30 } }).expect(201)).body);
    a = await make(0.95, "good");
    b = await make(0.75, "worse");
  });
  afterAll(() => t.close());

  it("puts the newest MLE of each run side by side with differences to the first", async () => {
    const res = CompareSchema.parse((await f.clients.viewer.get(`/api/labs/${lab}/compare?runs=${a.id},${b.id}`).expect(200)).body);
    expect(res.items.map((i) => i.run.name)).toEqual(["good", "worse"]);
    expect(res.items.every((i) => i.reconstruction.method === "mle")).toBe(true);
    expect(res.differences).toHaveLength(1);
    const d = res.differences[0];
    expect(d).toMatchObject({ runId: b.id, relativeToRunId: a.id });
    expect(d.metrics.fidelityPsiMinus.delta).toBeCloseTo(res.items[1].reconstruction.metrics.fidelityPsiMinus! - res.items[0].reconstruction.metrics.fidelityPsiMinus!, 12);
    expect(Math.abs(d.metrics.fidelityPsiMinus.delta - -0.15)).toBeLessThan(0.02);
    expect(Math.abs(d.metrics.concurrence.delta - -0.3)).toBeLessThan(0.04);
    const sa = res.items[0].reconstruction.uncertainties!.metrics.fidelityPsiMinus!;
    const sb = res.items[1].reconstruction.uncertainties!.metrics.fidelityPsiMinus!;
    expect(d.metrics.fidelityPsiMinus.uncertainty).toBeCloseTo(Math.hypot(sa, sb), 12);
    expect(Math.abs(d.traceDistance - 0.15)).toBeLessThan(0.03);
    expect(d.rho.re[1][2]).toBeCloseTo(res.items[1].reconstruction.rho.re[1][2] - res.items[0].reconstruction.rho.re[1][2], 12);
    expect(d.fidelityBetween).toBeGreaterThan(0.9);
    expect(d.fidelityBetween).toBeLessThan(1);
  });

  it("compares exactly the chosen reconstructions, e.g. two methods of one run", async () => {
    const lin = a.reconstructions.find((r) => r.method === "linear")!;
    const mle = a.reconstructions.find((r) => r.method === "mle")!;
    const res = CompareSchema.parse((await f.clients.viewer.get(`/api/labs/${lab}/compare?reconstructions=${lin.id},${mle.id}`).expect(200)).body);
    expect(res.items.map((i) => i.reconstruction.id)).toEqual([lin.id, mle.id]);
    expect(res.differences[0].traceDistance).toBeLessThan(0.05);
  });

  it("is empty with nothing chosen, and names what is wrong otherwise", async () => {
    const empty = CompareSchema.parse((await f.clients.viewer.get(`/api/labs/${lab}/compare`).expect(200)).body);
    expect(empty.items).toEqual([]);
    const one = await f.clients.viewer.get(`/api/labs/${lab}/compare?runs=${a.id}`).expect(400);
    expect(one.body.error.details).toEqual([{ field: "runs", message: "Choose at least 2 runs to compare." }]);
    const missing = await f.clients.viewer.get(`/api/labs/${lab}/compare?runs=${a.id},${crypto.randomUUID()}`).expect(400);
    expect(missing.body.error.details[0].field).toBe("runs.1");
    await f.clients.viewer.get(`/api/labs/${lab}/compare?runs=${a.id},${b.id}&method=projected`).expect(400);
    await f.clients.outsider.get(`/api/labs/${lab}/compare?runs=${a.id},${b.id}`).expect(404);
  });
});
