/**
 * Cells of the Bell and fringe entry tables: a whole number ≥ 0 or empty, with spreadsheet
 * pastes spread over the cells to the right and below (the counts grid's own parser).
 */
import { isBlock, parseBlock, parseCell } from "../countsEntry/clipboard";

export type CellCheck = { value: number } | { error: string } | { empty: true };

export function checkCount(text: string): CellCheck {
  const v = parseCell(text);
  if (v === undefined) return { empty: true };
  if (typeof v !== "number" || !Number.isInteger(v) || v < 0) return { error: "A whole number ≥ 0." };
  return { value: v };
}

/** Writes a pasted block into `grid` from (row, col); returns null when the text is a single cell. */
export function pastedGrid(grid: string[][], row: number, col: number, text: string): string[][] | null {
  if (!isBlock(text)) return null;
  const next = grid.map((r) => [...r]);
  parseBlock(text).forEach((cells, i) =>
    cells.forEach((cell, j) => {
      if (next[row + i] && col + j < next[row + i].length) next[row + i][col + j] = cell;
    }),
  );
  return next;
}
