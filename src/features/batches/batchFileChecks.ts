import { LIMITS } from "@shared/limits";

/**
 * What the browser can tell about chosen files before sending them — the same limits the server
 * applies (it checks again, and also looks inside zips and sweep files).
 */
export interface ChosenFile {
  file: File;
  /** Why the server will refuse this file, if it surely will. */
  problem: string | null;
}

const READABLE = /\.(csv|tsv|txt|json|zip)$/i;
export const ACCEPT = ".csv,.tsv,.txt,.json,.zip,text/csv,application/json,application/zip";

export function megabytes(bytes: number): string {
  return `${(bytes / 1_000_000).toLocaleString("en", { maximumFractionDigits: 1 })} MB`;
}

/** A file's size in the unit that suits it (decimal units, as the limits are written). */
export function fileSize(bytes: number): string {
  if (bytes < 1000) return `${bytes} B`;
  if (bytes < 1_000_000) return `${(bytes / 1000).toLocaleString("en", { maximumFractionDigits: 1 })} kB`;
  return megabytes(bytes);
}

export function checkFile(file: File): ChosenFile {
  if (!READABLE.test(file.name)) return { file, problem: "not a type Rhomb reads (.csv, .json or .zip)" };
  const zip = /\.zip$/i.test(file.name);
  if (!zip && file.size > LIMITS.uploadBytes) return { file, problem: `larger than ${megabytes(LIMITS.uploadBytes)}` };
  if (file.size === 0) return { file, problem: "empty" };
  return { file, problem: null };
}

/** A problem with the batch as a whole: the server would refuse all of it. */
export function batchProblem(files: ChosenFile[]): string | null {
  const total = files.reduce((s, f) => s + f.file.size, 0);
  if (total > LIMITS.batchUploadBytes) return `These files add up to ${megabytes(total)}; one batch takes at most ${megabytes(LIMITS.batchUploadBytes)}. Upload them in several batches.`;
  if (files.length > LIMITS.batchFiles) return `One batch takes at most ${LIMITS.batchFiles.toLocaleString("en")} files; you chose ${files.length.toLocaleString("en")}.`;
  return null;
}

/** Adds files, skipping ones already chosen (same name, size and date). */
export function addFiles(current: ChosenFile[], added: File[]): ChosenFile[] {
  const key = (f: File) => `${f.name}|${f.size}|${f.lastModified}`;
  const seen = new Set(current.map((c) => key(c.file)));
  return [...current, ...added.filter((f) => !seen.has(key(f))).map(checkFile)];
}
