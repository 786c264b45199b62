import { describe, expect, it } from "vitest";
import { simulateCounts, standardSet } from "@shared/physics";
import { isBlock, parseBlock, parseCell, planPaste } from "../../src/features/countsEntry/clipboard";
import { checkEntry, type EntryRow } from "../../src/features/countsEntry/entryChecks";
import { gridRows, setLabels, type Conventions } from "../../src/features/countsEntry/gridRows";
import { switchRows } from "../../src/features/countsEntry/runForm";
import { UndoHistory } from "../../src/features/countsEntry/undoHistory";

const IDEAL: Conventions = {
  handedness: "R=H+iV",
  calibration: [0, 1].map(() => ({ qwp: { fastAxisOffsetDeg: 0, retardanceErrorDeg: 0 }, hwp: { fastAxisOffsetDeg: 0, retardanceErrorDeg: 0 } })),
  analyser: { arms: [{ bothPorts: false }, { bothPorts: false }] },
};
/** ψ⁻ = (|HV⟩ − |VH⟩)/√2 in the basis order HH, HV, VH, VV. */
const PSI_MINUS = {
  re: [
    [0, 0, 0, 0],
    [0, 0.5, -0.5, 0],
    [0, -0.5, 0.5, 0],
    [0, 0, 0, 0],
  ],
  im: [0, 1, 2, 3].map(() => [0, 0, 0, 0]),
};

describe("clipboard: pasting spreadsheet cells into the grid", () => {
  const target = { labels: ["HH", "HV", "VV", "VH"], columns: ["counts", "seconds"] };

  it("splits tab/newline text and ignores the trailing newline spreadsheets add", () => {
    expect(parseBlock("1\t2\r\n3\t4\r\n")).toEqual([["1", "2"], ["3", "4"]]);
    expect(isBlock("12")).toBe(false);
    expect(isBlock("12\n13")).toBe(true);
  });

  it("fills a column downwards from the focused cell and counts what did not fit", () => {
    const plan = planPaste(parseBlock("5\n6\n7\n8"), { row: 2, column: "counts" }, target);
    expect(plan.writes).toEqual([
      { row: 2, column: "counts", text: "5" },
      { row: 3, column: "counts", text: "6" },
    ]);
    expect(plan.dropped).toBe(2);
  });

  it("fills a block rightwards across the editable columns", () => {
    const plan = planPaste(parseBlock("10\t1.5\n20\t2"), { row: 0, column: "counts" }, target);
    expect(plan.writes.map((w) => `${w.row}.${w.column}=${w.text}`)).toEqual(["0.counts=10", "0.seconds=1.5", "1.counts=20", "1.seconds=2"]);
  });

  it("matches rows by setting label when the first pasted column holds labels", () => {
    const plan = planPaste(parseBlock("VH\t40\nhh\t10\nXY\t3"), { row: 0, column: "counts" }, target);
    expect(plan.byLabel).toBe(true);
    expect(plan.writes).toEqual([
      { row: 3, column: "counts", text: "40" },
      { row: 0, column: "counts", text: "10" },
    ]);
    expect(plan.unknownLabels).toEqual(["XY"]);
  });

  it("reads numbers, thousands separators and leaves other text for validation to name", () => {
    expect(parseCell(" 1234 ")).toBe(1234);
    expect(parseCell("12,345")).toBe(12345);
    expect(parseCell("1.5e3")).toBe(1500);
    expect(parseCell("0.25")).toBe(0.25);
    expect(parseCell("")).toBeUndefined();
    expect(parseCell("12a")).toBe("12a");
    expect(parseCell("1,5")).toBe("1,5");
  });
});

describe("grid rows: angles from the engine", () => {
  it("lists the 16 James et al. settings with the ideal-plate angles for H, V, D and R", () => {
    const rows = gridRows(setLabels("tomo16"), "tomo16", IDEAL);
    expect(rows).toHaveLength(16);
    const byLabel = new Map(rows.map((r) => [r.label, r]));
    // Ideal QWP → HWP → PBS passing H (physics contract §2), common practice, no source: a HWP at
    // 45° swaps H and V, so V is (0°, 45°); D is an eigenstate of a QWP at 45° and a HWP at 22.5°
    // turns D into H, so D is (45°, 22.5°).
    expect(byLabel.get("HV")!.arms.map((a) => [a.qwpDeg, a.hwpDeg])).toEqual([
      [0, 0],
      [0, 45],
    ]);
    expect(byLabel.get("DD")!.arms[0]).toMatchObject({ qwpDeg: 45, hwpDeg: 22.5, port: "transmitted" });
    expect(rows.every((r) => r.startsSetting)).toBe(true);
  });

  it("groups the two-detector set's four outcomes under one setting, measured at both ports", () => {
    const labels = setLabels("pairs9");
    const rows = gridRows(labels, "pairs9", IDEAL);
    expect(rows).toHaveLength(36);
    expect(rows.filter((r) => r.startsSetting)).toHaveLength(9);
    const vh = rows.find((r) => r.label === "VH")!;
    expect(vh.arms.map((a) => a.port)).toEqual(["reflected", "transmitted"]);
    const hh = rows.find((r) => r.label === "HH")!;
    expect(vh.arms.map((a) => a.hwpDeg)).toEqual(hh.arms.map((a) => a.hwpDeg));
  });

  it("gives no angles to a custom row that is not a two-photon label", () => {
    expect(gridRows(["HQ"], "custom", IDEAL)[0].arms).toEqual([]);
  });
});

describe("switching setting sets keeps counts by label", () => {
  it("carries the 16 counts into the 36-setting set and loses nothing", () => {
    const rows = setLabels("tomo16").map((setting, i) => ({ setting, counts: i + 1 }));
    const { rows: next, lost } = switchRows(rows, "tomo36");
    expect(next).toHaveLength(36);
    expect(next.find((r) => r.setting === "RL")!.counts).toBe(16);
    expect(lost).toEqual([]);
  });
  it("names the counts a smaller set would drop", () => {
    const rows = setLabels("tomo36").map((setting) => ({ setting, counts: 5 }));
    expect(switchRows(rows, "tomo16").lost).toHaveLength(20);
  });
});

describe("live checks while counts are typed", () => {
  const labels = standardSet("tomo16").labels;
  // Invented counts: ψ⁻ at 4000 pairs/s for 1 s, Poisson noise with a fixed seed (demo-style data).
  const clean = simulateCounts({ rho: PSI_MINUS, settings: labels, pairRate: 4000, seed: 7 }).map((r, i) => ({ label: labels[i], counts: r.counts }));

  it("waits for every row, naming how many are missing", () => {
    const partial: EntryRow[] = clean.map((r, i) => (i < 12 ? r : { ...r, counts: undefined }));
    const c = checkEntry(partial, {});
    expect(c.linear).toBeNull();
    expect(c.estimateNote).toBe("4 of 16 rows still need counts; the estimate appears when all are in.");
  });

  it("names unreadable rows", () => {
    const c = checkEntry(clean.map((r, i) => (i === 2 ? { ...r, counts: "12a" } : r)), {});
    expect(c.unreadable).toEqual([2]);
    expect(c.estimateNote).toMatch(/^Row 3 is not a whole number/);
  });

  it("gives a linear estimate close to ψ⁻ and flags nothing for clean counts", () => {
    const c = checkEntry(clean, {});
    expect(c.outliers).toEqual([]);
    expect(c.linear).not.toBeNull();
    // ⟨HV|ρ|VH⟩ of ψ⁻ is −1/2 (definition of ψ⁻); 4000 pairs leave a few per cent of noise.
    expect(c.linear!.rho.re[1][2]).toBeCloseTo(-0.5, 1);
  });

  it("flags a mistyped count (an extra digit) as far from what the other rows imply", () => {
    const hv = labels.indexOf("HV");
    const typo = clean.map((r, i) => (i === hv ? { ...r, counts: r.counts * 10 } : r));
    const c = checkEntry(typo, {});
    expect(c.outliers.map((o) => o.row)).toEqual([hv]);
    // Once HV is set aside, the other rows imply about the count that was meant.
    expect(c.outliers[0].expected).toBeGreaterThan(clean[hv].counts * 0.8);
    expect(c.outliers[0].expected).toBeLessThan(clean[hv].counts * 1.2);
    expect(c.linear!.physical).toBe(false);
  });

  it("marks zeros and low statistics", () => {
    const low = clean.map((r) => ({ ...r, counts: Math.round(r.counts / 1000) }));
    const c = checkEntry(low, {});
    expect(c.lowCounts).toBe(true);
    expect(c.zeros.length).toBeGreaterThan(0);
  });
});

describe("undo history", () => {
  it("undoes and redoes in order, and a new change forgets the redo", () => {
    const h = new UndoHistory<number>();
    h.record(1);
    h.record(2);
    expect(h.undo(3)).toBe(2);
    expect(h.undo(2)).toBe(1);
    expect(h.redo(1)).toBe(2);
    h.record(2);
    expect(h.redo(5)).toBeUndefined();
  });
});
