/**
 * Zip archives of run files, unpacked with fflate's streaming Unzip. The archive is fed in small
 * slices and every member's output is counted as it appears, so a "zip bomb" (a small archive
 * that would expand to gigabytes) is refused after a few megabytes of work instead of after
 * filling memory; the sizes an archive declares are not trusted.
 *
 * Limits (LIMITS in shared/limits.ts): members per archive, bytes per member, unpacked bytes in
 * all, and unpacked size ÷ archive size. Folders and the metadata some systems add
 * (__MACOSX/, .DS_Store, names starting with ".") are skipped without a message.
 */
import { Unzip, UnzipInflate, UnzipPassThrough, type UnzipFile } from "fflate";
import { LIMITS } from "../limits";

export interface ZipLimits {
  maxMembers: number;
  maxMemberBytes: number;
  maxUnpackedBytes: number;
  maxExpansionRatio: number;
}

export const DEFAULT_ZIP_LIMITS: ZipLimits = {
  maxMembers: LIMITS.batchFiles,
  maxMemberBytes: LIMITS.uploadBytes,
  maxUnpackedBytes: LIMITS.zipUnpackedBytes,
  maxExpansionRatio: LIMITS.zipExpansionRatio,
};

export interface ZipMember {
  /** Path inside the archive, e.g. "sweep/5mW.csv". */
  path: string;
  bytes: Uint8Array;
}

/** A member that was not unpacked, and why (the rest of the archive still is). */
export interface ZipRefusal {
  path: string;
  message: string;
}

/** The archive as a whole cannot be used; nothing from it is kept. */
export class ZipBatchError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "ZipBatchError";
  }
}

const SLICE_BYTES = 16 * 1024;
const ZIP_MAGIC = [0x50, 0x4b, 0x03, 0x04];

export function looksLikeZip(bytes: Uint8Array): boolean {
  return ZIP_MAGIC.every((b, i) => bytes[i] === b);
}

export function isSkippedZipPath(path: string): boolean {
  const parts = path.split("/");
  const base = parts[parts.length - 1];
  return path.endsWith("/") || parts.includes("__MACOSX") || base.startsWith(".");
}

export function unpackZip(zip: Uint8Array, limits: ZipLimits = DEFAULT_ZIP_LIMITS): { members: ZipMember[]; refused: ZipRefusal[] } {
  if (!looksLikeZip(zip)) throw new ZipBatchError("this is not a zip archive (it does not start with a zip header)");
  const unpackedLimit = Math.min(limits.maxUnpackedBytes, Math.max(zip.length, 1) * limits.maxExpansionRatio);
  const members: ZipMember[] = [];
  const refused: ZipRefusal[] = [];
  let unpacked = 0;
  let seen = 0;

  const onFile = (file: UnzipFile) => {
    if (isSkippedZipPath(file.name)) return;
    seen += 1;
    if (seen > limits.maxMembers) throw new ZipBatchError(`the archive holds more than ${limits.maxMembers} files, the most one batch takes; split it into several batches`);
    if (/\.zip$/i.test(file.name)) {
      refused.push({ path: file.name, message: "a zip inside a zip is not unpacked; add its files to the outer archive instead" });
      return;
    }
    if (file.compression !== 0 && file.compression !== 8) {
      refused.push({ path: file.name, message: `compression method ${file.compression} is not supported (use the usual "deflate")` });
      return;
    }
    const chunks: Uint8Array[] = [];
    let size = 0;
    let tooLarge = false;
    file.ondata = (err, chunk, final) => {
      // fflate hands an error thrown by this handler back to it; pass ours on unchanged.
      if (err instanceof ZipBatchError) throw err;
      if (err) throw new ZipBatchError(`"${file.name}" cannot be unpacked: ${err.message}`);
      size += chunk.length;
      unpacked += chunk.length;
      if (unpacked > unpackedLimit) {
        throw new ZipBatchError(
          unpackedLimit < limits.maxUnpackedBytes
            ? `the archive unpacks to more than ${limits.maxExpansionRatio} times its own size; it was refused as a likely "zip bomb"`
            : `the archive unpacks to more than ${megabytes(limits.maxUnpackedBytes)}, the most one batch takes`,
        );
      }
      if (size > limits.maxMemberBytes) {
        if (!tooLarge) refused.push({ path: file.name, message: `larger than ${megabytes(limits.maxMemberBytes)} once unpacked, the most one run file may be` });
        tooLarge = true;
        chunks.length = 0;
      } else if (!tooLarge) chunks.push(chunk);
      if (final && !tooLarge) members.push({ path: file.name, bytes: concat(chunks, size) });
    };
    file.start();
  };

  const unzipper = new Unzip(onFile);
  unzipper.register(UnzipInflate);
  unzipper.register(UnzipPassThrough);
  try {
    for (let at = 0; at < zip.length; at += SLICE_BYTES) unzipper.push(zip.subarray(at, at + SLICE_BYTES), at + SLICE_BYTES >= zip.length);
  } catch (e) {
    if (e instanceof ZipBatchError) throw e;
    throw new ZipBatchError(`the archive is damaged or uses a feature we cannot read (${(e as Error).message})`);
  }
  if (seen === 0) throw new ZipBatchError("the archive holds no files");
  return { members, refused };
}

function concat(chunks: Uint8Array[], size: number): Uint8Array {
  if (chunks.length === 1) return chunks[0];
  const out = new Uint8Array(size);
  let at = 0;
  for (const c of chunks) {
    out.set(c, at);
    at += c.length;
  }
  return out;
}

function megabytes(bytes: number): string {
  return `${(bytes / 1_000_000).toLocaleString("en", { maximumFractionDigits: 1 })} MB`;
}
