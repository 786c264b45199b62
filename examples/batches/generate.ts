/**
 * Regenerates the batch-upload examples of this folder: `npx tsx examples/batches/generate.ts`.
 * Invented demo data (the "Sagnac-2" source of the demo scenario, not a measurement), drawn from
 * known states with Poisson noise and fixed seeds, so the files reproduce byte for byte.
 *
 *   pump-power-sweep.csv      sweep CSV: the pump power sweep, one run per line (1 … 20 mW)
 *   pump-power-sweep/*.json   the same sweep as one-run JSON files, one per power
 *   phase-compensation.zip    a zip of one-run CSV files: the compensation-plate tilt scan
 *   bad-day/                  what a bad day looks like: a misaligned run (stored, low
 *                             concurrence) and two malformed files (refused with row and column)
 *
 * Source model (invented): p·|ψ(φ)⟩⟨ψ(φ)| + (1 − p)·I/4, ψ(φ) = (|HV⟩ + e^{iφ}|VH⟩)/√2, with
 * p = 0.98 and φ = π (ψ⁻) unless a file says otherwise; 1500 detected pairs /s and 20 000 singles
 * /s per arm per mW of pump; 3 ns coincidence window, so accidentals grow with the square of the
 * pump power.
 */
import { mkdirSync, writeFileSync } from "node:fs";
import { zipSync, strToU8 } from "fflate";
import { simulateCounts, standardSet, type CountsRow, type DensityMatrix } from "../../shared/physics";
import { writeTomographyCsv } from "../../shared/formats/tomographyCsv";
import { writeSweepCsv } from "../../shared/formats/sweepCsv";
import { RUN_JSON_FORMAT } from "../../shared/formats/runJson";
import { wernerLike } from "../../server/db/seeds/demoStates";

const WINDOW_NS = 3;
const LABELS = standardSet("tomo16").labels;
const here = (name: string) => new URL(name, import.meta.url);
const NOTE = "Invented demo data for Rhomb (not a measurement): Sagnac-2 source, simulated with Poisson noise";

function counts(rho: DensityMatrix, pumpMw: number, seed: number, seconds = 1): CountsRow[] {
  return simulateCounts({ rho, settings: LABELS, pairRate: 1500 * pumpMw, seconds, seed, singles: { rateA: 20_000 * pumpMw, rateB: 20_000 * pumpMw, windowNs: WINDOW_NS } });
}

const POWERS = [1, 2, 5, 10, 20];
const sweep = POWERS.map((mw, i) => ({ name: `${mw} mW`, pumpPowerMw: mw, rows: counts(wernerLike(0.98), mw, 301 + i) }));
writeFileSync(here("pump-power-sweep.csv"), writeSweepCsv(sweep, [`${NOTE}.`, `Pump power sweep, 16 settings per run, 1 s per setting, window ${WINDOW_NS} ns, seeds 301-305.`]));

mkdirSync(here("pump-power-sweep/"), { recursive: true });
POWERS.forEach((mw, i) => {
  const run = {
    format: RUN_JSON_FORMAT,
    name: `${mw} mW`,
    settingSetId: "tomo16",
    notes: `${NOTE}; seed ${401 + i}.`,
    conditions: { pumpPowerMw: mw },
    rows: counts(wernerLike(0.98), mw, 401 + i),
    // Ask for accidental subtraction (the session's 3 ns window): the fidelity then stays high at 20 mW.
    reconstruction: { corrections: { accidentals: true } },
  };
  writeFileSync(here(`pump-power-sweep/sagnac2-${String(mw).padStart(2, "0")}mW.json`), `${JSON.stringify(run, null, 2)}\n`);
});

const TILTS = [-2, -1, 0, 1, 2];
const zip: Record<string, Uint8Array> = {};
TILTS.forEach((tilt, i) => {
  // Invented response: 40° of phase per degree of plate tilt around the compensated point.
  const phase = Math.PI + (tilt * 40 * Math.PI) / 180;
  const rows = counts(wernerLike(0.98, phase), 5, 501 + i);
  zip[`phase-compensation/tilt ${tilt > 0 ? "+" : ""}${tilt}deg.csv`] = strToU8(writeTomographyCsv(rows, [`${NOTE}.`, `Compensator tilt ${tilt}°, pump 5 mW, seed ${501 + i}.`]));
});
writeFileSync(here("phase-compensation.zip"), zipSync(zip, { level: 9, mtime: new Date("2026-03-02T12:00:00Z") }));

mkdirSync(here("bad-day/"), { recursive: true });
writeFileSync(here("bad-day/misaligned.csv"), writeTomographyCsv(counts(wernerLike(0.35), 5, 601), [`${NOTE}.`, "A misaligned run: mostly mixed, low concurrence (seed 601). It is stored; the numbers show the problem."]));
const typo = writeTomographyCsv(counts(wernerLike(0.98), 5, 602), [`${NOTE}.`, "Malformed on purpose: the RV counts have a letter o typed for a zero, so the file is refused (row 9, column counts)."]);
writeFileSync(here("bad-day/typo-in-counts.csv"), typo.replace(/\nRV,(\d)\d/, "\nRV,$1o"));
const short = { format: RUN_JSON_FORMAT, name: "Interrupted run", settingSetId: "tomo16", notes: `${NOTE}. Malformed on purpose: the acquisition stopped after 12 of 16 settings.`, rows: counts(wernerLike(0.98), 5, 603).slice(0, 12) };
writeFileSync(here("bad-day/interrupted.json"), `${JSON.stringify(short, null, 2)}\n`);
