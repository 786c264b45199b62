/**
 * Pasting from a spreadsheet into the counts grid: a column, a row or a block of cells
 * (tab- or newline-separated). When the block's first column holds setting labels, rows are
 * matched by label instead of by position, so a sheet in any row order lands correctly.
 */

export interface PasteTarget {
  /** Row labels of the grid, in grid order. */
  labels: string[];
  /** Editable columns, left to right (e.g. counts, seconds, singlesA, singlesB). */
  columns: string[];
}

export interface CellWrite {
  row: number;
  column: string;
  text: string;
}

export interface PastePlan {
  writes: CellWrite[];
  /** Cells that fell outside the grid and were not written. */
  dropped: number;
  byLabel: boolean;
  /** Labels in the pasted block that the grid does not have. */
  unknownLabels: string[];
}

/** Splits clipboard text into rows of cells; a trailing newline (spreadsheets add one) is ignored. */
export function parseBlock(text: string): string[][] {
  const lines = text.replace(/\r\n?/g, "\n").replace(/\n+$/, "").split("\n");
  return lines.map((line) => line.split("\t").map((c) => c.trim()));
}

/** True when the text is more than one cell, so the grid should take over the paste. */
export function isBlock(text: string): boolean {
  const b = parseBlock(text);
  return b.length > 1 || b[0].length > 1;
}

/** A first cell that looks like a setting label (letters only), known to the grid or not. */
const LABEL = /^[A-Za-z]{1,4}$/;

export function planPaste(block: string[][], start: { row: number; column: string }, target: PasteTarget): PastePlan {
  const startCol = target.columns.indexOf(start.column);
  if (startCol < 0) throw new Error(`column ${start.column} is not editable`);
  const nonEmpty = block.filter((r) => r.some((c) => c !== ""));
  const byLabel = nonEmpty.length > 0 && nonEmpty.every((r) => r.length > 1 && LABEL.test(r[0]));
  const writes: CellWrite[] = [];
  const unknownLabels: string[] = [];
  let dropped = 0;
  const place = (row: number, cells: string[]) => {
    cells.forEach((text, k) => {
      const col = startCol + k;
      if (row < 0 || row >= target.labels.length || col >= target.columns.length) dropped++;
      else writes.push({ row, column: target.columns[col], text });
    });
  };
  if (byLabel) {
    const index = new Map(target.labels.map((l, i) => [l.toUpperCase(), i]));
    for (const r of nonEmpty) {
      const row = index.get(r[0].toUpperCase());
      if (row === undefined) {
        unknownLabels.push(r[0]);
        dropped += r.length - 1;
      } else place(row, r.slice(1));
    }
  } else {
    block.forEach((cells, k) => place(start.row + k, cells));
  }
  return { writes, dropped, byLabel, unknownLabels };
}

/**
 * A cell's text as the form stores it: a number when it reads as one (a plain decimal, or an
 * integer with comma or space thousands separators), nothing when empty, else the text itself
 * so that validation names it.
 */
export function parseCell(text: string): number | string | undefined {
  const t = text.trim();
  if (t === "") return undefined;
  const grouped = /^\d{1,3}([, \u2009\u00a0]\d{3})+$/.test(t) ? t.replace(/[, \u2009\u00a0]/g, "") : t;
  if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(grouped)) return t;
  return Number(grouped);
}
