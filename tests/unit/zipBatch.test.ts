import { describe, expect, it } from "vitest";
import { strToU8, zipSync } from "fflate";
import { unpackZip, ZipBatchError, type ZipLimits } from "@shared/formats/zipBatch";

const LIMITS: ZipLimits = { maxMembers: 5, maxMemberBytes: 1000, maxUnpackedBytes: 100_000, maxExpansionRatio: 50 };

function refusal(f: () => unknown): string {
  try {
    f();
  } catch (e) {
    if (e instanceof ZipBatchError) return e.message;
    throw e;
  }
  throw new Error("expected a ZipBatchError");
}

describe("zip batches", () => {
  it("unpacks members (stored or deflated) and skips folders and system metadata", () => {
    const zip = zipSync({ "a.csv": strToU8("basis,counts\nHH,1\n"), "day/b.json": [strToU8("{}"), { level: 0 }], "__MACOSX/._a.csv": strToU8("x"), "day/.DS_Store": strToU8("x") });
    const { members, refused } = unpackZip(zip, LIMITS);
    expect(members.map((m) => [m.path, new TextDecoder().decode(m.bytes)])).toEqual([
      ["a.csv", "basis,counts\nHH,1\n"],
      ["day/b.json", "{}"],
    ]);
    expect(refused).toEqual([]);
  });

  it("refuses single members that are too large or zips inside the zip, and keeps the rest", () => {
    const zip = zipSync({ "big.csv": new Uint8Array(1500).fill(65), "inner.zip": zipSync({ "x.csv": strToU8("1") }), "ok.csv": strToU8("x") }, { level: 0 });
    const { members, refused } = unpackZip(zip, LIMITS);
    expect(members.map((m) => m.path)).toEqual(["ok.csv"]);
    expect(refused).toEqual([
      { path: "big.csv", message: expect.stringMatching(/^larger than .* once unpacked, the most one run file may be$/) },
      { path: "inner.zip", message: "a zip inside a zip is not unpacked; add its files to the outer archive instead" },
    ]);
  });

  it("refuses an archive that expands far more than its size (a zip bomb), whatever its header claims", () => {
    const bomb = zipSync({ "zeros.csv": new Uint8Array(5_000_000) }, { level: 9 });
    expect(bomb.length).toBeLessThan(10_000);
    expect(refusal(() => unpackZip(bomb, { ...LIMITS, maxMemberBytes: 10_000_000, maxUnpackedBytes: 10_000_000 }))).toMatch(/more than 50 times its own size.*zip bomb/);
  });

  it("refuses archives with too many files, in all too large, empty or damaged", () => {
    const many = zipSync(Object.fromEntries(Array.from({ length: 6 }, (_, i) => [`${i}.csv`, strToU8("x")])));
    expect(refusal(() => unpackZip(many, LIMITS))).toMatch(/more than 5 files/);
    const large = zipSync(Object.fromEntries(Array.from({ length: 4 }, (_, i) => [`${i}.csv`, new Uint8Array(900).fill(66)])), { level: 0 });
    expect(refusal(() => unpackZip(large, { ...LIMITS, maxUnpackedBytes: 2000 }))).toMatch(/unpacks to more than/);
    expect(refusal(() => unpackZip(zipSync({ "folder/": new Uint8Array() }), LIMITS))).toBe("the archive holds no files");
    expect(refusal(() => unpackZip(strToU8("not a zip"), LIMITS))).toMatch(/not a zip archive/);
    const damaged = zipSync({ "a.csv": strToU8("basis,counts\n".repeat(50)) });
    damaged.fill(0x13, 40, 60);
    expect(refusal(() => unpackZip(damaged, LIMITS))).toMatch(/damaged|cannot be unpacked/);
  });
});
