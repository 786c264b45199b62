/**
 * Export CSV files (our layouts; README "Sharing and exports" documents them):
 *
 * counts.csv — the raw rows of one revision exactly as stored, in the run file format the upload
 *   reads (shared/formats/tomographyCsv.ts): `#` comment lines saying what the file is, then
 *   `basis,counts,seconds[,singles_a,singles_b][,monitor]`. When rows were entered as waveplate
 *   angles, `basis` is empty for them and `arm_a_qwp_deg,arm_a_hwp_deg,arm_a_port,…` follow it
 *   (the upload reads that variant back too).
 * rho.csv — one line per element of ρ: `row,column,re,im,sigma_re,sigma_im` (basis states such as
 *   HV; σ empty without Monte Carlo samples).
 * metrics.csv — one line per reconstruction: where it comes from, the method and its corrections,
 *   then every figure of merit and its σ (`concurrence,concurrence_sigma,…`).
 *
 * Numbers are written with JavaScript's shortest round-trip form, so nothing is rounded away.
 * Text cells that a spreadsheet would run as a formula (=, +, −, @ first) are prefixed with '.
 */
import Papa from "papaparse";
import { basisLabels } from "../physics/reconstruct";
import { METRIC_KEYS, type MetricKey } from "../schemas/reconstructions";
import type { CountsRowDto } from "../schemas/runs";
import type { CountsRow } from "../physics/types";
import { writeTomographyCsv } from "./tomographyCsv";
import type { ExportContext } from "../schemas/exports";
import type { ExportableReconstruction } from "./exportJson";

const ARM_LETTERS = ["a", "b", "c", "d"];

const unparse = (fields: string[], data: unknown[][]) => Papa.unparse({ fields, data }, { escapeFormulae: true, newline: "\n" }) + "\n";

/** Comment lines must stay one line each, whatever the names contain. */
const oneLine = (text: string) => text.replace(/[\r\n]+/g, " ");

export function countsCsv(context: ExportContext, rows: CountsRowDto[], exportedAt: Date = new Date()): string {
  const comments = [
    `Rhomb counts export: ${context.run} (revision ${context.revision})`,
    `source ${context.source}; session ${context.session}, ${context.sessionDate}`,
    `raw counts as recorded; exported ${exportedAt.toISOString()}`,
  ].map(oneLine);
  if (rows.every((r) => typeof r.setting === "string")) return writeTomographyCsv(rows.map(engineRow), comments);
  return comments.map((c) => `# ${c}\n`).join("") + anglesCsv(rows);
}

/** Stored rows use null for "not recorded"; the run file writer expects the field absent. */
const engineRow = (r: CountsRowDto): CountsRow => ({
  setting: r.setting,
  counts: r.counts,
  seconds: r.seconds,
  ...(r.singlesA !== null && { singlesA: r.singlesA }),
  ...(r.singlesB !== null && { singlesB: r.singlesB }),
  ...(r.monitor !== null && { monitor: r.monitor }),
});

/** Rows entered as waveplate angles: one qwp, hwp and port column per arm beside `basis` (empty for them). */
function anglesCsv(rows: CountsRowDto[]): string {
  const arms = Math.max(...rows.map((r) => r.setting.length));
  const singles = rows.some((r) => r.singlesA !== null || r.singlesB !== null);
  const monitor = rows.some((r) => r.monitor !== null);
  const fields = ["basis", ...ARM_LETTERS.slice(0, arms).flatMap((a) => [`arm_${a}_qwp_deg`, `arm_${a}_hwp_deg`, `arm_${a}_port`]), "counts", "seconds", ...(singles ? ["singles_a", "singles_b"] : []), ...(monitor ? ["monitor"] : [])];
  const data = rows.map((r) => [
    typeof r.setting === "string" ? r.setting : null,
    ...Array.from({ length: arms }, (_, i) => {
      const arm = typeof r.setting === "string" ? undefined : r.setting[i];
      return arm ? [arm.qwpDeg, arm.hwpDeg, arm.port ?? "transmitted"] : [null, null, null];
    }).flat(),
    r.counts,
    r.seconds,
    ...(singles ? [r.singlesA, r.singlesB] : []),
    ...(monitor ? [r.monitor] : []),
  ]);
  return unparse(fields, data);
}

export function rhoCsv(rec: Pick<ExportableReconstruction, "rho" | "uncertainties">): string {
  const labels = basisLabels(Math.round(Math.log2(rec.rho.re.length)));
  const sigma = rec.uncertainties?.rho ?? null;
  const data = labels.flatMap((rowLabel, i) => labels.map((colLabel, j) => [rowLabel, colLabel, rec.rho.re[i][j], rec.rho.im[i][j], sigma?.re[i][j] ?? null, sigma?.im[i][j] ?? null]));
  return unparse(["row", "column", "re", "im", "sigma_re", "sigma_im"], data);
}

/** fidelityPhiPlus → fidelity_phi_plus */
export const metricColumn = (key: MetricKey) => key.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`);

export function metricsCsv(items: Array<{ context: ExportContext; reconstruction: ExportableReconstruction }>): string {
  const fields = [
    "source",
    "session",
    "session_date",
    "run",
    "revision",
    "method",
    "accidentals_subtracted",
    "window_ns",
    "efficiencies_applied",
    "drift",
    "physical",
    "monte_carlo_samples",
    "monte_carlo_seed",
    "engine_version",
    "computed_at",
    ...METRIC_KEYS.flatMap((k) => [metricColumn(k), `${metricColumn(k)}_sigma`]),
  ];
  const data = items.map(({ context: c, reconstruction: r }) => [
    c.source,
    c.session,
    c.sessionDate,
    c.run,
    c.revision,
    r.method,
    r.corrections.accidentals,
    r.corrections.windowNs,
    r.corrections.efficiencies !== null,
    r.corrections.drift,
    r.physical,
    r.uncertainties?.samples ?? 0,
    r.uncertainties?.seed ?? null,
    r.engineVersion,
    r.createdAt,
    ...METRIC_KEYS.flatMap((k) => [r.metrics[k], r.uncertainties?.metrics[k] ?? null]),
  ]);
  return unparse(fields, data);
}
