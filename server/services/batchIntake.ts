import { createHash } from "node:crypto";
import { LIMITS } from "@shared/limits";
import { describeIssue, RunFileError } from "@shared/formats/runJson";
import { isSweepCsv, readSweepCsv, sweepLineAsCsv } from "@shared/formats/sweepCsv";
import { looksLikeZip, unpackZip, ZipBatchError } from "@shared/formats/zipBatch";
import type { BatchFileFormat } from "@shared/schemas/batches";

/**
 * What an upload holds, unit by unit, before anything is stored: each plain file, each zip
 * member, each line of a sweep CSV becomes one entry. An entry that cannot even be read (too
 * large, not a type we read, a sweep file with a bad header) carries its refusal instead of a
 * format; it is recorded as failed at once, while the rest of the batch goes ahead.
 */
export interface IntakeEntry {
  fileName: string;
  format: BatchFileFormat | null;
  sourceLine: number | null;
  content: Buffer | null;
  sha256: string | null;
  sizeBytes: number;
  refusal: string | null;
}

export interface UploadedPart {
  originalname: string;
  buffer: Buffer;
}

const MB = (bytes: number) => `${(bytes / 1_000_000).toLocaleString("en", { maximumFractionDigits: 1 })} MB`;

export function intake(files: UploadedPart[]): IntakeEntry[] {
  return files.flatMap((f) => {
    const name = cleanName(f.originalname);
    if (!looksLikeZip(f.buffer) && !/\.zip$/i.test(name)) return readFile(name, f.buffer);
    try {
      const { members, refused } = unpackZip(f.buffer);
      return [
        ...members.flatMap((m) => readFile(`${name} › ${m.path}`, Buffer.from(m.bytes.buffer, m.bytes.byteOffset, m.bytes.byteLength))),
        ...refused.map((r) => refusedEntry(`${name} › ${r.path}`, 0, r.message)),
      ];
    } catch (e) {
      if (e instanceof ZipBatchError) return [refusedEntry(name, f.buffer.length, e.message)];
      throw e;
    }
  });
}

function readFile(name: string, bytes: Buffer): IntakeEntry[] {
  if (bytes.length > LIMITS.uploadBytes) return [refusedEntry(name, bytes.length, `larger than ${MB(LIMITS.uploadBytes)}, the most one run file may be (a sweep of many runs can be split, or zipped with its neighbours)`)];
  if (bytes.length === 0) return [refusedEntry(name, 0, "the file is empty")];
  if (/\.json$/i.test(name)) return [entry(name, "run-json", bytes, null)];
  if (!/\.(csv|tsv|txt)$/i.test(name)) return [refusedEntry(name, bytes.length, "not a file type Rhomb reads: give run files as .csv or .json, or a .zip of them")];
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    return [refusedEntry(name, bytes.length, "the file is not UTF-8 text (Latin-1 or UTF-16, perhaps); save it as CSV in UTF-8 and upload it again")];
  }
  // Only the layout is sniffed here; a one-run CSV is read (and judged) by the notebook's upload service.
  if (!isSweepCsv(text)) return [entry(name, "run-csv", bytes, null)];
  try {
    const sweep = readSweepCsv(text);
    return sweep.records.map((r) => entry(`${name} › row ${r.line}`, "sweep-line", Buffer.from(sweepLineAsCsv(sweep, r), "utf8"), r.line));
  } catch (e) {
    if (e instanceof RunFileError) return [refusedEntry(name, bytes.length, e.issues.map(describeIssue).join("; "))];
    throw e;
  }
}

function entry(fileName: string, format: BatchFileFormat, content: Buffer, sourceLine: number | null): IntakeEntry {
  return { fileName, format, sourceLine, content, sha256: createHash("sha256").update(content).digest("hex"), sizeBytes: content.length, refusal: null };
}

function refusedEntry(fileName: string, sizeBytes: number, refusal: string): IntakeEntry {
  return { fileName, format: null, sourceLine: null, content: null, sha256: null, sizeBytes, refusal };
}

/** Browsers send a bare name; other clients may send a path or odd characters. */
function cleanName(name: string): string {
  const base = name.split(/[\\/]/).pop() ?? "";
  return base.replace(/[\u0000-\u001f]/g, "").slice(0, 200) || "unnamed file";
}
