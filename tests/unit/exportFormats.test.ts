import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { countsCsv, metricColumn, rhoCsv } from "@shared/formats/exportCsv";
import { metricsJson, rhoJson } from "@shared/formats/exportJson";
import { bundleFileName, readSessionBundle } from "@shared/formats/sessionBundle";
import { parseTomographyCsv } from "@shared/formats/tomographyCsv";
import { MetricsExportSchema, RhoExportSchema } from "@shared/schemas/exports";
import { METRIC_KEYS, type Metrics } from "@shared/schemas/reconstructions";
import type { CountsRowDto } from "@shared/schemas/runs";

const context = { source: "Sagnac-2", session: "Pump power sweep", sessionDate: "2026-03-02", run: "5 mW", revision: 1 };
const row = (setting: CountsRowDto["setting"], counts: number, extra: Partial<CountsRowDto> = {}): CountsRowDto => ({ setting, counts, seconds: 1, singlesA: null, singlesB: null, monitor: null, ...extra });
const metrics = Object.fromEntries(METRIC_KEYS.map((k, i) => [k, i / 100])) as Metrics;
// ψ⁻ = (|HV⟩ − |VH⟩)/√2 has ρ with ½ on the HV/VH diagonal and −½ off it (textbook, e.g. Nielsen & Chuang 2000, §1.3.6).
const psiMinus = { re: [[0, 0, 0, 0], [0, 0.5, -0.5, 0], [0, -0.5, 0.5, 0], [0, 0, 0, 0]], im: [[0, 0, 0, 0], [0, 0, 0, 0], [0, 0, 0, 0], [0, 0, 0, 0]] };
const reconstruction = { method: "mle" as const, corrections: { accidentals: true, windowNs: 3, efficiencies: null, drift: "none" as const }, physical: true, uncertainties: null, engineVersion: "1.0.0", createdAt: "2026-03-02T10:00:00.000Z", rho: psiMinus, eigenvalues: [1, 0, 0, 0], metrics };

describe("export file layouts", () => {
  it("counts.csv of label rows is read back by the run file parser unchanged, singles and fractional exposures included", () => {
    const rows = [row("HH", 12, { singlesA: 40_000, singlesB: 39_000, seconds: 0.5 }), row("HV", 5012, { singlesA: 40_100, singlesB: 38_900, seconds: 0.5 })];
    const parsed = parseTomographyCsv(countsCsv(context, rows, new Date("2026-03-02T12:00:00Z")), { allowRepeats: true });
    expect(parsed.rows).toEqual(rows.map(({ monitor: _m, ...r }) => r));
    expect(parsed.comments).toEqual(["Rhomb counts export: 5 mW (revision 1)", "source Sagnac-2; session Pump power sweep, 2026-03-02", "raw counts as recorded; exported 2026-03-02T12:00:00.000Z"]);
  });

  it("a line break in a name cannot end a comment line early", () => {
    const text = countsCsv({ ...context, run: "5 mW\nHH,999999" }, [row("HH", 1)]);
    expect(parseTomographyCsv(text, { allowRepeats: true }).rows.map((r) => r.counts)).toEqual([1]);
  });

  it("counts.csv of rows entered as waveplate angles has one qwp/hwp/port column per arm", () => {
    const text = countsCsv(context, [row([{ qwpDeg: 0, hwpDeg: 22.5 }, { qwpDeg: 45, hwpDeg: -11.25, port: "reflected" }], 730)]);
    const records = Papa.parse<Record<string, string>>(text, { header: true, comments: "#", skipEmptyLines: true }).data;
    expect(records).toEqual([{ basis: "", arm_a_qwp_deg: "0", arm_a_hwp_deg: "22.5", arm_a_port: "transmitted", arm_b_qwp_deg: "45", arm_b_hwp_deg: "-11.25", arm_b_port: "reflected", counts: "730", seconds: "1" }]);
  });

  it("rho.csv has one line per element in the basis order HH, HV, VH, VV and empty σ without Monte Carlo", () => {
    const lines = rhoCsv(reconstruction).trim().split("\n");
    expect(lines[0]).toBe("row,column,re,im,sigma_re,sigma_im");
    expect(lines).toHaveLength(17);
    expect(lines[1 + 4 * 1 + 2]).toBe("HV,VH,-0.5,0,,");
    expect(lines[1 + 4 * 2 + 2]).toBe("VH,VH,0.5,0,,");
  });

  it("rho.json and metrics.json match their schemas", () => {
    const rho = RhoExportSchema.parse(rhoJson(context, reconstruction));
    expect(rho.basis).toEqual(["HH", "HV", "VH", "VV"]);
    expect(rho.sigmaReal).toBeNull();
    expect(rho.reconstruction.monteCarlo).toBeNull();
    const m = MetricsExportSchema.parse(metricsJson([{ context, reconstruction }]));
    expect(m.items[0].figures.concurrence).toEqual({ value: metrics.concurrence, sigma: null });
    expect(Object.keys(m.items[0].figures)).toEqual([...METRIC_KEYS]);
  });

  it("metric columns are snake_case of the metric keys", () => {
    expect(metricColumn("fidelityPsiMinus")).toBe("fidelity_psi_minus");
    expect(metricColumn("chshMax")).toBe("chsh_max");
    expect(metricColumn("phasePsiDeg")).toBe("phase_psi_deg");
  });
});

describe("reading a session bundle", () => {
  it("names the problem when the file is not JSON", () => {
    const result = readSessionBundle("{ runs: [");
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.problems[0]).toMatchObject({ field: "bundle", message: expect.stringMatching(/^The file is not valid JSON/) });
  });

  it("says what a bundle is when handed another file", () => {
    const result = readSessionBundle(JSON.stringify({ format: "rhomb-density-matrix", formatVersion: 1 }));
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.problems).toContainEqual({ field: "format", message: 'This is not a Rhomb session bundle (format must be "rhomb-session-bundle").' });
  });

  it("gives bundle files a safe, dated name", () => {
    expect(bundleFileName("Pump power sweep (5 → 20 mW)", "2026-03-02")).toBe("session-pump-power-sweep-5-20-mw-2026-03-02.rhomb.json");
  });
});
