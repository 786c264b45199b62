/**
 * The file readers of shared/formats never crash: on any text (or bytes) they answer a value or
 * their own typed error with a message that names where the problem is. A TypeError, a
 * RangeError or a message like "Cannot read properties of undefined" is a crash. Where a
 * reader has a writer, writing and reading back gives the rows unchanged (raw counts are never
 * altered).
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { zipSync } from "fflate";
import { parseTomographyCsv, TomographyCsvError, writeTomographyCsv } from "@shared/formats/tomographyCsv";
import { parseRunJson, RunFileError } from "@shared/formats/runJson";
import { isSweepCsv, parseSweepCsv, readSweepCsv, writeSweepCsv } from "@shared/formats/sweepCsv";
import { unpackZip, ZipBatchError } from "@shared/formats/zipBatch";
import { readSessionBundle } from "@shared/formats/sessionBundle";
import { decodeUtf8Text } from "@shared/formats/utf8Text";
import { standardSet, type CountsRow } from "@shared/physics";

const CRASH = /Cannot read propert|is not a function|is not iterable|of undefined|of null|Maximum call stack/;

/** Calls a reader; only its own error class may come out, with a message that is not a crash's. */
function readOrRefuse<T>(read: () => T, ...allowed: Array<new (...a: never[]) => Error>): T | Error {
  try {
    return read();
  } catch (e) {
    if (!allowed.some((k) => e instanceof k)) throw new Error(`crashed: ${(e as Error)?.name}: ${(e as Error)?.message}`);
    expect((e as Error).message).not.toMatch(CRASH);
    expect((e as Error).message.length).toBeGreaterThan(5);
    return e as Error;
  }
}

const tomo16 = standardSet("tomo16").labels;
const csvCell = fc.oneof(
  fc.constantFrom("", "0", "12", "-5", "1.5", "1e3", "NaN", "Infinity", "99999999999999999999", "HH", "hv", "RX", " 7 ", '"', '"3"', "\t"),
  fc.string({ maxLength: 6 }),
  fc.integer({ min: 0, max: 1e15 }).map(String),
);
const csvHeader = fc.shuffledSubarray(["basis", "counts", "seconds", "singles_a", "singles_b", "monitor", "Basis", "COUNTS", "setting", "counts"], { minLength: 1 });
/** CSV-shaped text: mostly header + rows from a small alphabet, so the reader is pushed past the header. */
const csvLike = fc
  .tuple(csvHeader, fc.array(fc.array(csvCell, { minLength: 1, maxLength: 7 }), { maxLength: 20 }), fc.constantFrom(",", ";", "\t"), fc.constantFrom("\n", "\r\n"), fc.boolean())
  .map(([header, rows, sep, nl, comment]) => [...(comment ? ["# note"] : []), header.join(sep), ...rows.map((r) => r.join(sep))].join(nl));

describe("counts CSV reader (fast-check)", () => {
  it("any text: rows, or a TomographyCsvError naming a row of the file", () => {
    fc.assert(
      fc.property(fc.oneof(fc.string({ maxLength: 300 }), fc.string({ unit: "binary", maxLength: 200 }), csvLike), (text) => {
        const out = readOrRefuse(() => parseTomographyCsv(text), TomographyCsvError);
        if (out instanceof Error) {
          expect(out).toBeInstanceOf(TomographyCsvError);
          expect((out as TomographyCsvError).row).toBeGreaterThanOrEqual(1);
          expect((out as TomographyCsvError).row).toBeLessThanOrEqual(text.split("\n").length);
          expect(out.message).toMatch(/^row \d+/);
        } else {
          for (const r of out.rows) {
            expect(Number.isInteger(r.counts) && r.counts >= 0 && r.counts <= 1e15).toBe(true);
            expect(typeof r.setting === "string" && /^[HVDARL]{1,4}$/.test(r.setting)).toBe(true);
          }
        }
      }),
      { numRuns: 1500 },
    );
  });

  it("writing rows and reading them back gives the same counts, exposures and singles", () => {
    const row = fc.record({ counts: fc.integer({ min: 0, max: 1e15 }), seconds: fc.double({ min: 1e-3, max: 1e7, noNaN: true }), singlesA: fc.integer({ min: 0, max: 1e12 }), singlesB: fc.integer({ min: 0, max: 1e12 }) });
    fc.assert(
      fc.property(fc.array(row, { minLength: 16, maxLength: 16 }), fc.array(fc.string({ maxLength: 30 }).filter((c) => !/[\r\n]/.test(c)), { maxLength: 3 }), (values, comments) => {
        const rows: CountsRow[] = values.map((v, i) => ({ setting: tomo16[i], ...v }));
        const back = parseTomographyCsv(writeTomographyCsv(rows, comments));
        expect(back.rows).toEqual(rows);
        expect(back.comments).toEqual(comments.map((c) => c.trim()));
      }),
      { numRuns: 200 },
    );
  });
});

describe("one-run JSON reader (fast-check)", () => {
  const rowish = fc.record(
    { setting: fc.oneof(fc.constantFrom(...tomo16), fc.string({ maxLength: 5 }), fc.integer(), fc.constant(null)), counts: fc.oneof(fc.nat(), fc.double(), fc.string({ maxLength: 4 }), fc.constant(null)), seconds: fc.oneof(fc.double(), fc.nat()) },
    { requiredKeys: [] },
  );
  const runish = fc.record(
    { format: fc.oneof(fc.constant("rhomb-run/1"), fc.string({ maxLength: 8 })), name: fc.oneof(fc.string({ maxLength: 20 }), fc.integer()), settingSetId: fc.constantFrom("tomo16", "tomo36", "custom", "nope", 3), rows: fc.oneof(fc.array(rowish, { maxLength: 20 }), fc.jsonValue()), conditions: fc.jsonValue(), reconstruction: fc.jsonValue() },
    { requiredKeys: [] },
  );

  it("any JSON text or value: a run, or a RunFileError whose issues name a row and key where there is one", () => {
    fc.assert(
      fc.property(fc.oneof(fc.string({ maxLength: 200 }), fc.json(), runish.map((r) => JSON.stringify(r))), (text) => {
        const out = readOrRefuse(() => parseRunJson(text, { fallbackName: "fallback" }), RunFileError);
        if (out instanceof Error) {
          expect(out).toBeInstanceOf(RunFileError);
          const { issues } = out as RunFileError;
          expect(issues.length).toBeGreaterThan(0);
          for (const issue of issues) {
            expect(issue.message).not.toMatch(CRASH);
            if (issue.row !== null) expect(issue.row).toBeGreaterThanOrEqual(1);
          }
        } else expect(out.rows.length).toBeGreaterThan(0);
      }),
      { numRuns: 1500 },
    );
  });
});

describe("sweep CSV reader (fast-check)", () => {
  const sweepLike = fc
    .tuple(fc.shuffledSubarray(["run", "pump_mw", "seconds", ...tomo16.slice(0, 6), "HH_singles_a", "HH_singles_b", "XX", "run"], { minLength: 1 }), fc.array(fc.array(csvCell, { minLength: 1, maxLength: 10 }), { maxLength: 6 }))
    .map(([header, rows]) => [header.join(","), ...rows.map((r) => r.join(","))].join("\n"));

  it("any text: runs and per-line RunFileErrors, or one RunFileError for the whole file", () => {
    fc.assert(
      fc.property(fc.oneof(fc.string({ maxLength: 300 }), sweepLike), (text) => {
        readOrRefuse(() => isSweepCsv(text), RunFileError);
        const out = readOrRefuse(() => parseSweepCsv(text), RunFileError);
        if (!(out instanceof Error)) {
          for (const line of out) if ("error" in line) expect(line.error).toBeInstanceOf(RunFileError);
        }
      }),
      { numRuns: 1000 },
    );
  });

  it("writing runs and reading them back gives the same counts", () => {
    fc.assert(
      fc.property(fc.array(fc.array(fc.integer({ min: 0, max: 1e15 }), { minLength: 16, maxLength: 16 }), { minLength: 1, maxLength: 5 }), (counts) => {
        const runs = counts.map((c, i) => ({ name: `run ${i + 1}`, rows: c.map((n, k) => ({ setting: tomo16[k], counts: n })) }));
        const text = writeSweepCsv(runs);
        expect(readSweepCsv(text).records).toHaveLength(runs.length);
        const back = parseSweepCsv(text);
        back.forEach((line, i) => {
          expect("run" in line, JSON.stringify(line)).toBe(true);
          if ("run" in line) expect(line.run.rows.map((r) => r.counts)).toEqual(counts[i]);
        });
      }),
      { numRuns: 100 },
    );
  });
});

describe("zip reader (fast-check)", () => {
  it("any bytes: members, or a ZipBatchError", () => {
    const zipHeaded = fc.uint8Array({ maxLength: 400 }).map((b) => Uint8Array.from([0x50, 0x4b, 0x03, 0x04, ...b]));
    fc.assert(
      fc.property(fc.oneof(fc.uint8Array({ maxLength: 400 }), zipHeaded), (bytes) => {
        readOrRefuse(() => unpackZip(bytes), ZipBatchError);
      }),
      { numRuns: 1000 },
    );
  });

  it("a real zip with any member names and contents, damaged at any byte, is read or refused with a ZipBatchError", () => {
    // fflate builds the archive from an object's own keys; "__proto__" would not be one.
    const members = fc.dictionary(fc.string({ minLength: 1, maxLength: 20 }).filter((k) => k !== "__proto__"), fc.uint8Array({ maxLength: 300 }), { minKeys: 1, maxKeys: 5 });
    fc.assert(
      fc.property(members, fc.nat(), fc.integer({ min: 0, max: 255 }), (files, at, value) => {
        const zip = zipSync(files);
        const damaged = Uint8Array.from(zip);
        damaged[at % damaged.length] = value;
        readOrRefuse(() => unpackZip(damaged), ZipBatchError);
      }),
      { numRuns: 500 },
    );
  });
});

describe("session bundle reader (fast-check)", () => {
  it("any text never throws: a bundle, or problems that each name a field", () => {
    fc.assert(
      fc.property(fc.oneof(fc.string({ maxLength: 200 }), fc.json(), fc.record({ format: fc.constant("rhomb-session-bundle"), formatVersion: fc.jsonValue(), runs: fc.jsonValue(), session: fc.jsonValue(), source: fc.jsonValue() }).map((b) => JSON.stringify(b))), (text) => {
        const out = readOrRefuse(() => readSessionBundle(text));
        if (!(out instanceof Error) && !out.ok) {
          expect(out.problems.length).toBeGreaterThan(0);
          for (const p of out.problems) expect(p.field.length).toBeGreaterThan(0);
        }
      }),
      { numRuns: 500 },
    );
  });
});

describe("UTF-8 decoding of uploads (fast-check)", () => {
  it("any bytes: the text (without NUL, encoding back to the same bytes) or a reason", () => {
    fc.assert(
      fc.property(fc.oneof(fc.uint8Array({ maxLength: 200 }), fc.string({ unit: "binary", maxLength: 100 }).map((s) => new TextEncoder().encode(s))), (bytes) => {
        const out = decodeUtf8Text(bytes);
        if (out.ok) {
          expect(out.text.includes("\u0000")).toBe(false);
          // TextDecoder drops a leading byte-order mark, as every reader of ours would anyway.
          const bom = bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf;
          expect(Buffer.from(out.text, "utf8").equals(Buffer.from(bom ? bytes.subarray(3) : bytes))).toBe(true);
        } else expect(out.reason).toMatch(/UTF|NUL/);
      }),
      { numRuns: 1000 },
    );
  });
});
