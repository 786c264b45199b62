/**
 * What `reconstruct` and `bench` share: read a counts CSV, apply the setup options, and turn
 * every input problem into one line for stderr (exit code 2).
 */
import { readFileSync } from "node:fs";
import { parseTomographyCsv, TomographyCsvError } from "@shared/formats/tomographyCsv";
import { EngineInputError, type Handedness, type ReconstructInput } from "@shared/physics";

export class CliInputError extends Error {}

export const HANDEDNESS_VALUES: readonly Handedness[] = ["R=H+iV", "R=H-iV"];

export interface FileInput {
  input: ReconstructInput;
  windowNs: number | undefined;
  photons: number;
  file: string;
}

export function readTomographyFile(file: string | undefined, handedness: string | undefined, windowNs: string | undefined): FileInput {
  if (!file) throw new CliInputError("missing FILE.csv");
  const hand = (handedness ?? "R=H+iV") as Handedness;
  if (!HANDEDNESS_VALUES.includes(hand)) throw new CliInputError(`--handedness must be R=H+iV or R=H-iV, not "${handedness}"`);
  const window = windowNs === undefined ? undefined : Number(windowNs);
  if (window !== undefined && !(window > 0 && Number.isFinite(window))) {
    throw new CliInputError(`--window-ns must be a number > 0 (the full coincidence window in ns), not "${windowNs}"`);
  }
  let text: string;
  try {
    text = readFileSync(file, "utf8");
  } catch (e) {
    throw new CliInputError(`cannot read ${file}: ${(e as NodeJS.ErrnoException).code ?? (e as Error).message}`);
  }
  const parsed = parseTomographyCsv(text, { requireSingles: window !== undefined });
  return { input: { rows: parsed.rows, conventions: { handedness: hand } }, windowNs: window, photons: parsed.photons, file };
}

/** Prints the one-line message of an input problem and returns exit code 2; rethrows anything else. */
export function reportInputError(error: unknown, file: string | undefined): number {
  if (error instanceof TypeError && (error as { code?: string }).code?.startsWith("ERR_PARSE_ARGS")) {
    process.stderr.write(`${error.message}\n`);
    return 2;
  }
  if (error instanceof TomographyCsvError || error instanceof CliInputError || error instanceof EngineInputError) {
    const where = file && error instanceof TomographyCsvError ? `${file}: ` : "";
    process.stderr.write(`${where}${error.message.replace(/\s*\n\s*/g, " ")}\n`);
    return 2;
  }
  throw error;
}
