/**
 * What every view of ρ shares: basis labels, one vertical scale for Re ρ and Im ρ, and the
 * words that describe one element with its uncertainty.
 */
import { formatWithUncertainty } from "@shared/format/uncertainty";

export interface ComplexMatrix {
  re: number[][];
  im: number[][];
}

export type Part = "re" | "im";

export const PART_NAME: Record<Part, string> = { re: "Re", im: "Im" };

/** Basis labels in the contract's order: binary with H = 0, V = 1, photon A most significant. */
export function basisLabels(dimension: number): string[] {
  const photons = Math.round(Math.log2(dimension));
  return Array.from({ length: dimension }, (_, b) =>
    Array.from({ length: photons }, (_, arm) => ((b >> (photons - 1 - arm)) & 1 ? "V" : "H")).join(""),
  );
}

/** The smallest tenth at or above every |element| of both parts, so Re and Im share one scale. */
export function sharedScale(rho: ComplexMatrix): number {
  let max = 0;
  for (const part of [rho.re, rho.im]) for (const row of part) for (const x of row) max = Math.max(max, Math.abs(x));
  return Math.max(0.1, Math.ceil(max * 10 - 1e-9) / 10);
}

export interface ElementRef {
  part: Part;
  row: number;
  col: number;
}

/** "Re ⟨HV|ρ|VH⟩ = −0.481 ± 0.006" */
export function describeElement(rho: ComplexMatrix, sigma: ComplexMatrix | null | undefined, { part, row, col }: ElementRef): string {
  const labels = basisLabels(rho.re.length);
  const value = formatWithUncertainty(rho[part][row][col], sigma?.[part][row]?.[col]).text;
  return `${PART_NAME[part]} ⟨${labels[row]}|ρ|${labels[col]}⟩ = ${value}`;
}

/** Moves a focused element by arrow keys, staying inside the matrix. */
export function stepElement(at: { row: number; col: number }, key: string, dimension: number): { row: number; col: number } | null {
  const clamp = (x: number) => Math.min(dimension - 1, Math.max(0, x));
  switch (key) {
    case "ArrowLeft":
      return { row: at.row, col: clamp(at.col - 1) };
    case "ArrowRight":
      return { row: at.row, col: clamp(at.col + 1) };
    case "ArrowUp":
      return { row: clamp(at.row - 1), col: at.col };
    case "ArrowDown":
      return { row: clamp(at.row + 1), col: at.col };
    case "Home":
      return { row: at.row, col: 0 };
    case "End":
      return { row: at.row, col: dimension - 1 };
    default:
      return null;
  }
}
