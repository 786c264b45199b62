import { describe, expect, it } from "vitest";
import { isSweepCsv, parseSweepCsv, readSweepCsv, sweepLineAsCsv, writeSweepCsv } from "@shared/formats/sweepCsv";
import { RunFileError } from "@shared/formats/runJson";
import { LIMITS } from "@shared/limits";
import { standardSet } from "@shared/physics/settings";
import type { CountsRow } from "@shared/physics/types";

// Layout checks only (our own format); no physics is asserted here.
const LABELS = standardSet("tomo16").labels;
const rows = (base: number, singles = false): CountsRow[] => LABELS.map((setting, i) => ({ setting, counts: base + i, ...(singles && { singlesA: 40_000 + i, singlesB: 41_000 + i }) }));

function errorOf(f: () => unknown): RunFileError {
  try {
    f();
  } catch (e) {
    if (e instanceof RunFileError) return e;
    throw e;
  }
  throw new Error("expected a RunFileError");
}

describe("sweep CSV (one run per line)", () => {
  it("writes and reads back runs with conditions and singles, recognising the 16-setting set", () => {
    const text = writeSweepCsv([{ name: "1 mW", pumpPowerMw: 1, rows: rows(100, true) }, { name: "2 mW", pumpPowerMw: 2, rows: rows(200, true) }], ["pump power sweep"]);
    expect(isSweepCsv(text)).toBe(true);
    const parsed = parseSweepCsv(text);
    expect(parsed.map((p) => p.line)).toEqual([3, 4]);
    const [first] = parsed;
    if (!("run" in first)) throw first.error;
    expect(first.run).toMatchObject({ name: "1 mW", settingSetId: "tomo16", kind: "tomography", conditions: { pumpPowerMw: 1, crystalTemperatureC: null, compensatorTiltDeg: null } });
    expect(first.run.rows[0]).toEqual({ setting: "HH", counts: 100, seconds: 1, singlesA: 40_000, singlesB: 41_000, monitor: null });
    expect(first.run.rows.map((r) => r.setting)).toEqual(LABELS);
  });

  it("is told apart from the one-run CSV, whose header has a basis column", () => {
    expect(isSweepCsv("# note\nbasis,counts\nHH,1\n")).toBe(false);
    expect(isSweepCsv("run;HH;HV\n1;2;3\n")).toBe(true);
  });

  it("reports each bad line on its own, naming the line and the column as the file wrote it", () => {
    const text = `run,pump_mw,${LABELS.join(",")}\nok,1,${LABELS.map(() => 5).join(",")}\nbad,2,${LABELS.map((_, i) => (i === 1 ? "12x" : 5)).join(",")}\nworse,x,${LABELS.map(() => 5).join(",")}\nempty,3,${LABELS.map((_, i) => (i === 0 ? "" : 5)).join(",")}\n`;
    const out = parseSweepCsv(text);
    expect("run" in out[0]).toBe(true);
    const messages = out.slice(1).map((o) => ("error" in o ? o.error.message : "stored"));
    expect(messages).toEqual([
      'row 3, column "HV": "12x" is not a whole number ≥ 0',
      'row 4, column "pump_mw": "x" is not a number',
      'row 5, column "HH": empty (every setting needs its counts)',
    ]);
  });

  it("checks values with the API's run schema and maps its paths back to columns", () => {
    const text = `run,tilt_deg,${LABELS.join(",")},HH_singles_a,HH_singles_b\nfar,400,${LABELS.map(() => 5).join(",")},1,2\n`;
    const [out] = parseSweepCsv(text);
    if (!("error" in out)) throw new Error("expected an error");
    expect(out.error.issues).toEqual([{ row: 2, column: "tilt_deg", message: "Compensator tilt is between −360° and 360°." }]);
  });

  it("refuses the whole file for header problems: unknown, repeated or orphaned columns", () => {
    expect(errorOf(() => readSweepCsv("run,HH,HX\n1,2,3\n")).issues[0]).toMatchObject({ row: 1, column: "HX", message: expect.stringMatching(/^unknown column/) });
    expect(errorOf(() => readSweepCsv("run,HH,hh\n1,2,3\n")).issues[0]).toMatchObject({ column: "hh", message: "appears twice in the header" });
    expect(errorOf(() => readSweepCsv("run,HH,HV_singles_a,HV_singles_b\n1,2,3,4\n")).issues[0]).toMatchObject({ column: "HV_singles_a", message: "there is no column HV for these singles a" });
    expect(errorOf(() => readSweepCsv("run,HH,HH_singles_a\n1,2,3\n")).issues[0]).toMatchObject({ column: "HH_singles_b" });
    expect(errorOf(() => readSweepCsv("run,HH,HHV\n1,2,3\n")).issues[0]).toMatchObject({ column: "HHV", message: "names 3 photon(s) but column HH names 2" });
    expect(errorOf(() => readSweepCsv("run,HH\n")).message).toBe("row 1: there are no runs after the header");
  });

  it("keeps one line as a two-line CSV that reads back as the same run", () => {
    const text = writeSweepCsv([{ name: "a", rows: rows(1) }, { name: "b, with comma", rows: rows(9) }]);
    const file = readSweepCsv(text);
    const second = sweepLineAsCsv(file, file.records[1]);
    expect(second.split("\n")).toHaveLength(3);
    const [again] = parseSweepCsv(second, { firstLine: 3 });
    const [, original] = parseSweepCsv(text);
    expect(again).toEqual(original);
  });

  it("names a run without a name after its file and line", () => {
    const [out] = parseSweepCsv(`HH,HV\n1,2\n`, { fallbackName: "sweep" });
    expect("run" in out && out.run.name).toBe("sweep row 2");
    expect("run" in out && out.run.settingSetId).toBe("custom");
  });

  it(`refuses a sweep of more than ${LIMITS.sweepRuns} runs, naming the first line over the limit`, () => {
    const lines = Array.from({ length: LIMITS.sweepRuns + 1 }, (_, i) => `run ${i},1,2`).join("\n");
    const error = errorOf(() => readSweepCsv(`run,HH,HV\n${lines}\n`));
    expect(error.issues).toEqual([{ row: LIMITS.sweepRuns + 2, column: null, message: `a sweep file holds at most ${LIMITS.sweepRuns} runs; this one has ${LIMITS.sweepRuns + 1} — split it` }]);
  });
});
