import Papa from "papaparse";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { parseTomographyCsv } from "@shared/formats/tomographyCsv";
import { MetricsExportSchema, RhoExportSchema } from "@shared/schemas/exports";
import { METRIC_KEYS } from "@shared/schemas/reconstructions";
import { SnapshotSchema } from "@shared/schemas/shares";
import { expectNoLeak, sharingLab, type SharingFixture } from "../support/sharingFixture";
import { startTestApp, type TestApp } from "../support/testApp";

/**
 * Export files carry the raw counts exactly as stored and the results to full precision
 * (JavaScript's shortest round-trip number form), and nothing of the lab beyond the item:
 * no e-mail addresses, no people, no private notes, no other runs.
 */
describe("exports", () => {
  let t: TestApp;
  let s: SharingFixture;
  beforeAll(async () => {
    t = await startTestApp();
    s = await sharingLab(t);
  });
  afterAll(() => t.close());

  const get = (path: string, client = s.f.clients.viewer) => client.get(`/api/labs/${s.lab}${path}`);
  const mle = () => s.runA.reconstructions.find((r) => r.method === "mle")!;
  const csvRecords = (text: string) => Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: true }).data;

  it("counts.csv is the run file format: reading it back gives the stored rows exactly", async () => {
    const res = await get(`/runs/${s.runA.id}/counts.csv`).expect(200);
    expect(res.headers["content-type"]).toBe("text/csv; charset=utf-8");
    expect(res.headers["content-disposition"]).toBe('attachment; filename="shared-run-5-mw-counts-r1.csv"');
    const parsed = parseTomographyCsv(res.text);
    expect(parsed.rows).toEqual(s.runA.rows.map((r) => ({ setting: r.setting, counts: r.counts, seconds: r.seconds, singlesA: r.singlesA, singlesB: r.singlesB })));
    expect(parsed.comments[0]).toBe("Rhomb counts export: Shared run 5 mW (revision 1)");
    expectNoLeak(res.text, [...s.labSecrets, s.runB.name]);
  });

  it("counts.csv of an earlier revision keeps the counts as first entered", async () => {
    const corrected = s.runB.rows.map((r, i) => (i === 0 ? { ...r, counts: r.counts + 100 } : r));
    await s.f.clients.member.post(`/api/labs/${s.lab}/runs/${s.runB.id}/revisions`, { reason: "typo in HH", rows: corrected, reconstruction: { monteCarloSamples: 0 } }).expect(201);
    const first = parseTomographyCsv((await get(`/runs/${s.runB.id}/counts.csv?revision=1`).expect(200)).text);
    const current = parseTomographyCsv((await get(`/runs/${s.runB.id}/counts.csv`).expect(200)).text);
    expect(first.rows.map((r) => r.counts)).toEqual(s.runB.rows.map((r) => r.counts));
    expect(current.rows.map((r) => r.counts)).toEqual(corrected.map((r) => r.counts));
    const missing = await get(`/runs/${s.runB.id}/counts.csv?revision=9`).expect(404);
    expect(missing.body.error.message).toBe("Revision 9 of this run not found.");
  });

  it("rho.csv lists every element with its σ, in the basis order HH, HV, VH, VV", async () => {
    const rec = mle();
    const res = await get(`/reconstructions/${rec.id}/export/rho.csv`).expect(200);
    const records = csvRecords(res.text);
    expect(Object.keys(records[0])).toEqual(["row", "column", "re", "im", "sigma_re", "sigma_im"]);
    expect(records).toHaveLength(16);
    const labels = ["HH", "HV", "VH", "VV"];
    records.forEach((r, k) => {
      const [i, j] = [Math.floor(k / 4), k % 4];
      expect([r.row, r.column]).toEqual([labels[i], labels[j]]);
      expect(Number(r.re)).toBe(rec.rho.re[i][j]);
      expect(Number(r.im)).toBe(rec.rho.im[i][j]);
      expect(Number(r.sigma_re)).toBe(rec.uncertainties!.rho.re[i][j]);
      expect(Number(r.sigma_im)).toBe(rec.uncertainties!.rho.im[i][j]);
    });
  });

  it("rho.json and metrics.json follow their schemas and carry the stored numbers unchanged", async () => {
    const rec = mle();
    const rho = RhoExportSchema.parse((await get(`/reconstructions/${rec.id}/export/rho.json`).expect(200)).body);
    expect(rho).toMatchObject({ basis: ["HH", "HV", "VH", "VV"], real: rec.rho.re, imaginary: rec.rho.im, sigmaReal: rec.uncertainties!.rho.re, eigenvalues: rec.eigenvalues });
    expect(rho.context).toEqual({ source: expect.any(String), session: "Shared session", sessionDate: "2026-03-02", run: "Shared run 5 mW", revision: 1 });
    expect(rho.reconstruction).toMatchObject({ method: "mle", corrections: rec.corrections, monteCarlo: { samples: 30, seed: rec.uncertainties!.seed } });
    const res = await get(`/reconstructions/${rec.id}/export/metrics.json`).expect(200);
    const metrics = MetricsExportSchema.parse(res.body);
    expect(metrics.items).toHaveLength(1);
    for (const k of METRIC_KEYS) expect(metrics.items[0].figures[k]).toEqual({ value: rec.metrics[k], sigma: rec.uncertainties!.metrics[k] });
    expectNoLeak(res.body, [...s.labSecrets, s.runB.id, s.runB.name]);
  });

  it("metrics.csv of a session has one line per reconstruction of its runs' current counts, and no other session's", async () => {
    const res = await get(`/sessions/${s.sessionId}/export/metrics.csv`).expect(200);
    const records = csvRecords(res.text);
    const runB = (await get(`/runs/${s.runB.id}`).expect(200)).body;
    const current = [...s.runA.reconstructions, ...runB.reconstructions.filter((r: { revisionNumber: number }) => r.revisionNumber === runB.revisionNumber)];
    expect(records).toHaveLength(current.length);
    expect(new Set(records.map((r) => r.run))).toEqual(new Set([s.runA.name, s.runB.name]));
    const line = records.find((r) => r.run === s.runA.name && r.method === "mle")!;
    expect(Number(line.fidelity_psi_minus)).toBe(mle().metrics.fidelityPsiMinus);
    expect(Number(line.fidelity_psi_minus_sigma)).toBe(mle().uncertainties!.metrics.fidelityPsiMinus);
    expect(line.accidentals_subtracted).toBe("false");
    expectNoLeak(res.text, s.labSecrets);
  });

  it("a spreadsheet formula in a name is written as text, not as a formula", async () => {
    await s.f.clients.member.patch(`/api/labs/${s.lab}/runs/${s.runA.id}`, { name: "=HYPERLINK(\"http://evil.example\")" }).expect(200);
    const res = await get(`/sessions/${s.sessionId}/export/metrics.csv`).expect(200);
    expect(res.text).toContain(`"'=HYPERLINK(""http://evil.example"")"`);
    await s.f.clients.member.patch(`/api/labs/${s.lab}/runs/${s.runA.id}`, { name: "Shared run 5 mW" }).expect(200);
  });

  it("the report data of a run is the share snapshot: results, counts and setup, nothing private", async () => {
    const res = await get(`/reports/run/${s.runA.id}`).expect(200);
    const snapshot = SnapshotSchema.parse(res.body);
    expect(snapshot.runs.map((r) => r.id)).toEqual([s.runA.id]);
    expect(snapshot.setup.session.notes).toBeNull();
    expectNoLeak(res.body, [...s.labSecrets, s.runB.id]);
    const session = SnapshotSchema.parse((await get(`/reports/session/${s.sessionId}`).expect(200)).body);
    expect(session.runs.map((r) => r.id)).toEqual([s.runA.id, s.runB.id]);
  });

  it("names a wrong file or item type, and hides other labs' items", async () => {
    const bad = await get(`/reconstructions/${mle().id}/export/rho.xlsx`).expect(400);
    expect(bad.body.error.details[0].field).toBe("file");
    const badType = await get(`/reports/source/${s.runA.id}`).expect(400);
    expect(badType.body.error.details[0].field).toBe("itemType");
    await s.f.clients.outsider.get(`/api/labs/${s.f.otherLab.id}/runs/${s.runA.id}/counts.csv`).expect(404);
    await s.f.clients.outsider.get(`/api/labs/${s.f.otherLab.id}/reports/session/${s.sessionId}`).expect(404);
  });
});
