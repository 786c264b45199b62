/**
 * The counts CSV (shared/formats/tomographyCsv.ts): what it accepts, and that every refusal
 * names the row (line in the file) and the column.
 */
import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { parseTomographyCsv, TomographyCsvError, writeTomographyCsv } from "@shared/formats/tomographyCsv";
import { simulateCounts, standardSet } from "@shared/physics";
import { werner } from "./support/states";

const header = "basis,counts,seconds,singles_a,singles_b";

describe("accepted input", () => {
  it("reads rows, comments anywhere, blank lines, a BOM, CRLF and default exposure", () => {
    const text = "\uFEFF# invented demo data\r\nbasis,counts\r\n\r\nHH,12\r\n# a note\r\nhv,7\r\n";
    const parsed = parseTomographyCsv(text);
    expect(parsed.rows).toEqual([{ setting: "HH", counts: 12 }, { setting: "HV", counts: 7 }]);
    expect(parsed.lines).toEqual([4, 6]);
    expect(parsed.comments).toEqual(["invented demo data", "a note"]);
    expect(parsed.photons).toBe(2);
  });

  it("reads semicolon files from spreadsheets, optional columns and 1–4 photons", () => {
    const parsed = parseTomographyCsv("basis;counts;seconds;singles_a;singles_b;monitor\nHVD;5;2.5;100;90;1.02\nVVA;0;;7;8;\n");
    expect(parsed.rows[0]).toEqual({ setting: "HVD", counts: 5, seconds: 2.5, singlesA: 100, singlesB: 90, monitor: 1.02 });
    expect(parsed.rows[1]).toEqual({ setting: "VVA", counts: 0, seconds: 1, singlesA: 7, singlesB: 8 });
    expect(parsed.photons).toBe(3);
  });

  it("writes what it reads (round trip of simulated rows)", () => {
    const rows = simulateCounts({ rho: werner(0.9), settings: standardSet("tomo16").labels, pairRate: 1000, seconds: 2, seed: 1, singles: { rateA: 1e4, rateB: 1e4, windowNs: 3 } });
    const text = writeTomographyCsv(rows, ["Invented demo data"]);
    expect(parseTomographyCsv(text).rows).toEqual(rows);
  });

  it("reads every example file of examples/tomography", () => {
    for (const name of ["sagnac2-1mW-tomo16.csv", "sagnac2-5mW-tomo16.csv", "sagnac2-20mW-tomo16.csv", "sagnac2-5mW-tomo36.csv"]) {
      const parsed = parseTomographyCsv(readFileSync(new URL(`../../examples/tomography/${name}`, import.meta.url), "utf8"));
      expect(parsed.comments[0]).toMatch(/Invented demo data/);
      expect(parsed.rows.length).toBeGreaterThanOrEqual(16);
    }
  });
});

describe("refused input names the row and the column", () => {
  const cases: [string, string, string | RegExp][] = [
    ["empty file", "", 'row 1: the file is empty (expected a header with at least basis,counts)'],
    ["only comments", "# nothing here\n", /^row 1: the file is empty/],
    ["header without data", "basis,counts\n", "row 1: there are no data rows after the header"],
    ["missing counts column", "basis,seconds\nHH,1\n", 'row 1, column "counts": missing from the header (it needs at least basis,counts)'],
    ["missing header line", "HH,12\nHV,3\n", /^row 1, column "HH": unknown column/],
    ["a near miss of a column name", "basis,count\nHH,1\n", /^row 1, column "count": unknown column .* — did you mean "counts"\?$/],
    ["another separator in a column name", "basis,counts,Singles-B\nHH,1,2\n", /column "Singles-B": unknown column .* — did you mean "singles_b"\?$/],
    ["unknown column", "basis,counts,singels_a\nHH,1,2\n", /^row 1, column "singels_a": unknown column \(allowed: basis, counts, seconds, singles_a, singles_b, monitor, arm_a_qwp_deg, arm_a_hwp_deg, arm_a_port, … for arms a–d\)/],
    ["column twice", "basis,counts,counts\nHH,1,2\n", 'row 1, column "counts": appears twice in the header'],
    ["one singles column", "basis,counts,singles_a\nHH,1,2\n", 'row 1, column "singles_b": missing from the header (singles_a and singles_b come together)'],
    ["text in counts", `${header}\nHH,5,1,1,1\nHV,5,1,1,1\nVH,5,1,1,1\nVV,5,1,1,1\nDD,5,1,1,1\nRR,12x,1,1,1\n`, 'row 7, column "counts": "12x" is not a whole number ≥ 0'],
    ["negative counts", "basis,counts\nHH,-3\n", 'row 2, column "counts": "-3" is not a whole number ≥ 0'],
    ["NaN counts", "basis,counts\nHH,NaN\n", 'row 2, column "counts": "NaN" is not a whole number ≥ 0'],
    ["fractional counts", "basis,counts\nHH,2.5\n", 'row 2, column "counts": "2.5" is not a whole number ≥ 0'],
    ["huge counts", "basis,counts\nHH,10000000000000001\n", 'row 2, column "counts": "10000000000000001" is larger than the limit of 10^15'],
    ["empty counts", "basis,counts\nHH,\n", 'row 2, column "counts": empty (a whole number ≥ 0 is required)'],
    ["unknown letter", "basis,counts\nHX,3\n", 'row 2, column "basis": "HX" is not 1–4 letters from H, V, D, A, R, L (photon A first)'],
    ["five photons", "basis,counts\nHHHHH,3\n", 'row 2, column "basis": "HHHHH" is not 1–4 letters from H, V, D, A, R, L (photon A first)'],
    ["mixed photon numbers", "basis,counts\nHH,3\nHHV,4\n", 'row 3, column "basis": "HHV" names 3 photon(s) but row 2 names 2'],
    ["repeated setting", "basis,counts\nHH,3\nHV,4\n#\nHH,5\n", 'row 5, column "basis": "HH" repeats row 2'],
    ["zero exposure", "basis,counts,seconds\nHH,3,0\n", 'row 2, column "seconds": "0" is not a number > 0'],
    ["text exposure", "basis,counts,seconds\nHH,3,1s\n", 'row 2, column "seconds": "1s" is not a number > 0'],
    ["too many values", "basis,counts\nHH,3,4\n", "row 2: 3 values but the header has 2 columns"],
    ["one singles value", "basis,counts,singles_a,singles_b\nHH,3,10,\n", 'row 2, column "singles_b": empty, but the other singles value is given (give both or neither)'],
    ["negative monitor", "basis,counts,monitor\nHH,3,-1\n", 'row 2, column "monitor": "-1" is not a number > 0'],
    ["unclosed quote", 'basis,counts\nHH,"3\n', /^row 2: /],
  ];
  for (const [name, text, message] of cases) {
    it(name, () => {
      let error: unknown;
      try {
        parseTomographyCsv(text);
      } catch (e) {
        error = e;
      }
      expect(error).toBeInstanceOf(TomographyCsvError);
      if (typeof message === "string") expect((error as Error).message).toBe(message);
      else expect((error as Error).message).toMatch(message);
    });
  }

  it("with accidental subtraction requested, singles are required in the header and on every row", () => {
    expect(() => parseTomographyCsv("basis,counts\nHH,3\n", { requireSingles: true })).toThrow('row 1, column "singles_a": missing from the header; accidental subtraction needs singles_a and singles_b');
    expect(() => parseTomographyCsv("basis,counts,singles_a,singles_b\nHH,3,1,1\nHV,3,,\n", { requireSingles: true })).toThrow('row 3, column "singles_a": empty (a whole number ≥ 0 is required)');
  });

  it("repeats are accepted when the caller allows them", () => {
    expect(parseTomographyCsv("basis,counts\nHH,3\nHH,4\n", { allowRepeats: true }).rows).toHaveLength(2);
  });
});

describe("counts CSV with waveplate angles instead of labels (our format, README 'Run file format')", () => {
  it("reads each arm's QWP and HWP angles and port, as Bell tests and fringe scans need", () => {
    const text = [
      "arm_a_qwp_deg,arm_a_hwp_deg,arm_b_qwp_deg,arm_b_hwp_deg,arm_b_port,counts,seconds",
      "0,0,22.5,11.25,transmitted,812,10",
      "0,0,22.5,11.25,reflected,95,10",
    ].join("\n");
    const parsed = parseTomographyCsv(text);
    expect(parsed.photons).toBe(2);
    expect(parsed.rows[0].setting).toEqual([
      { qwpDeg: 0, hwpDeg: 0, port: "transmitted" },
      { qwpDeg: 22.5, hwpDeg: 11.25, port: "transmitted" },
    ]);
    expect(parsed.rows[1].setting).toEqual([
      { qwpDeg: 0, hwpDeg: 0, port: "transmitted" },
      { qwpDeg: 22.5, hwpDeg: 11.25, port: "reflected" },
    ]);
  });

  it("mixes label rows and angle rows (basis empty on the angle rows), as the counts export writes them", () => {
    const parsed = parseTomographyCsv("basis,arm_a_qwp_deg,arm_a_hwp_deg,arm_b_qwp_deg,arm_b_hwp_deg,counts\nHV,,,,,100\n,0,22.5,0,0,50\n");
    expect(parsed.rows.map((r) => r.setting)).toEqual(["HV", [{ qwpDeg: 0, hwpDeg: 22.5, port: "transmitted" }, { qwpDeg: 0, hwpDeg: 0, port: "transmitted" }]]);
  });

  it("names the row and column of a bad angle or port, and a header with only one plate of an arm", () => {
    expect(() => parseTomographyCsv("arm_a_qwp_deg,arm_a_hwp_deg,counts\n0,x,5\n")).toThrow('row 2, column "arm_a_hwp_deg": "x" is not an angle in degrees');
    expect(() => parseTomographyCsv("arm_a_qwp_deg,arm_a_hwp_deg,arm_a_port,counts\n0,0,left,5\n")).toThrow('row 2, column "arm_a_port": "left" is not a PBS port');
    expect(() => parseTomographyCsv("arm_a_qwp_deg,counts\n0,5\n")).toThrow('row 1, column "arm_a_hwp_deg": missing from the header');
    expect(() => parseTomographyCsv("arm_a_qwp_deg,arm_a_hwp_deg,counts\n0,0,5\n0,0,6\n")).toThrow("row 3: these waveplate angles repeat row 2");
  });
});
