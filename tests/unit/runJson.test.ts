import { describe, expect, it } from "vitest";
import { inferSettingSetId, parseRunJson, RunFileError, RUN_JSON_FORMAT } from "@shared/formats/runJson";
import { standardSet } from "@shared/physics/settings";
import { LIMITS } from "@shared/limits";

// Layout checks only (our own format).
const rows16 = standardSet("tomo16").labels.map((setting, i) => ({ setting, counts: 10 + i }));

function issuesOf(text: string) {
  try {
    parseRunJson(text);
  } catch (e) {
    if (e instanceof RunFileError) return e.issues;
    throw e;
  }
  throw new Error("expected a RunFileError");
}

describe("one-run JSON", () => {
  it("reads the API's own run fields, filling in name and setting set", () => {
    const run = parseRunJson(JSON.stringify({ format: RUN_JSON_FORMAT, rows: rows16, conditions: { pumpPowerMw: 5 } }), { fallbackName: "5mW" });
    expect(run).toMatchObject({ name: "5mW", settingSetId: "tomo16", kind: "tomography", conditions: { pumpPowerMw: 5 } });
    expect(run.rows[3]).toEqual({ setting: "VH", counts: 13, seconds: 1, singlesA: null, singlesB: null, monitor: null });
    expect(run.reconstruction.monteCarloSamples).toBe(200);
  });

  it("names the entry of rows (1-based) and the key of each problem", () => {
    const bad = rows16.map((r, i) => (i === 2 ? { ...r, counts: -1 } : i === 7 ? { ...r, seconds: 0 } : r));
    expect(issuesOf(JSON.stringify({ name: "x", rows: bad }))).toEqual([
      { row: 3, column: "counts", message: "Counts cannot be negative." },
      { row: 8, column: "seconds", message: "Exposure must be above 0 s." },
    ]);
    expect(issuesOf(JSON.stringify({ name: "", rows: rows16 }))).toEqual([{ row: null, column: "name", message: "Give the run a name, e.g. “5 mW”." }]);
  });

  it("says when the text is not JSON, not an object, or another layout", () => {
    expect(issuesOf("{ nope")[0].message).toMatch(/^not valid JSON/);
    expect(issuesOf("[1,2]")[0].message).toMatch(/one JSON object/);
    expect(issuesOf(JSON.stringify({ format: "other/2", rows: rows16 }))[0]).toMatchObject({ column: "format" });
  });

  it("recognises a standard set only when the labels are exactly its settings", () => {
    expect(inferSettingSetId(standardSet("tomo36").labels)).toBe("tomo36");
    expect(inferSettingSetId([...standardSet("tomo16").labels].reverse())).toBe("tomo16");
    expect(inferSettingSetId(standardSet("tomo16").labels.slice(1))).toBe("custom");
    expect(inferSettingSetId(["H", "V", "D", "R"])).toBe("qubit4");
    expect(inferSettingSetId(["HH", "HH"])).toBe("custom");
  });

  it(`refuses a run of more than ${LIMITS.runRows} rows`, () => {
    const rows = Array.from({ length: LIMITS.runRows + 1 }, () => ({ setting: "HH", counts: 1 }));
    expect(issuesOf(JSON.stringify({ name: "long", settingSetId: "custom", rows }))).toEqual([{ row: null, column: "rows", message: `At most ${LIMITS.runRows} rows.` }]);
  });
});
