/**
 * Spreadsheet habits for the counts grid: Enter and the arrow keys move between cells, a pasted
 * column or block fills many cells at once, and Ctrl-Z / Ctrl-Shift-Z (or Ctrl-Y) undo and redo
 * every edit, paste and change of setting set.
 */
import { useCallback, useRef, useState } from "react";
import type { UseFormReturn } from "react-hook-form";
import { isBlock, parseBlock, parseCell, planPaste } from "./clipboard";
import { UndoHistory } from "./undoHistory";
import type { CellColumn, RunFormRow, RunFormValues } from "./runForm";

export interface Snapshot {
  settingSetId: RunFormValues["settingSetId"];
  rows: RunFormRow[];
}

interface Options {
  form: UseFormReturn<RunFormValues, unknown, unknown>;
  /** Visible editable columns, left to right. */
  columns: CellColumn[];
  labels: string[];
  /** Puts a whole snapshot back (rows may differ in number or labels). */
  restore: (s: Snapshot) => void;
  gridId: string;
}

const cellOf = (el: EventTarget | null) => {
  const input = el as HTMLInputElement | null;
  const row = input?.dataset?.row;
  const col = input?.dataset?.col as CellColumn | undefined;
  return row !== undefined && col ? { input: input!, row: Number(row), col } : null;
};

export function useGridEditing({ form, columns, labels, restore, gridId }: Options) {
  const history = useRef(new UndoHistory<Snapshot>());
  const atFocus = useRef<string>("");
  const [announcement, setAnnouncement] = useState("");

  const snapshot = useCallback((): Snapshot => {
    const v = form.getValues();
    return { settingSetId: v.settingSetId, rows: structuredClone(v.rows) };
  }, [form]);

  const focusCell = useCallback(
    (row: number, col: CellColumn) => {
      const el = document.querySelector<HTMLInputElement>(`[data-grid="${gridId}"] [data-row="${row}"][data-col="${col}"]`);
      el?.focus();
      // focus() fires no event on the cell that already has focus; keep its baseline current.
      if (el) atFocus.current = el.value;
    },
    [gridId],
  );

  /** Called before any change made by code, so that it can be undone. */
  const record = useCallback(() => history.current.record(snapshot()), [snapshot]);

  const commitCell = (input: HTMLInputElement, row: number, col: CellColumn) => {
    if (input.value === atFocus.current) return;
    const before = snapshot();
    before.rows[row] = { ...before.rows[row], [col]: parseCell(atFocus.current) };
    history.current.record(before);
    atFocus.current = input.value;
  };

  const undoOrRedo = (redo: boolean, cell: ReturnType<typeof cellOf>) => {
    if (!redo && cell && cell.input.value !== atFocus.current) {
      // First undo inside a cell being edited puts back what it held when it was entered.
      form.setValue(`rows.${cell.row}.${cell.col}`, parseCell(atFocus.current), { shouldDirty: true });
      setAnnouncement(`Undid the edit of ${cell.col} in row ${cell.row + 1}.`);
      return;
    }
    const current = snapshot();
    const target = redo ? history.current.redo(current) : history.current.undo(current);
    if (!target) {
      setAnnouncement(redo ? "Nothing to redo." : "Nothing to undo.");
      return;
    }
    restore(target);
    if (cell) requestAnimationFrame(() => focusCell(cell.row, cell.col));
    setAnnouncement(redo ? "Redone." : "Undone.");
  };

  const onFocus = (e: React.FocusEvent) => {
    const cell = cellOf(e.target);
    if (!cell) return;
    atFocus.current = cell.input.value;
    cell.input.select();
  };

  const onBlur = (e: React.FocusEvent) => {
    const cell = cellOf(e.target);
    if (cell) commitCell(cell.input, cell.row, cell.col);
  };

  const onKeyDown = (e: React.KeyboardEvent) => {
    const cell = cellOf(e.target);
    if (!cell) return;
    const mod = e.ctrlKey || e.metaKey;
    if (mod && (e.key === "z" || e.key === "Z" || e.key === "y")) {
      e.preventDefault();
      undoOrRedo(e.key === "y" || e.shiftKey, cell);
      return;
    }
    const c = columns.indexOf(cell.col);
    const { selectionStart, selectionEnd, value } = cell.input;
    let next: { row: number; col: CellColumn } | null = null;
    if (e.key === "Enter" || e.key === "ArrowDown") next = { row: cell.row + (e.shiftKey && e.key === "Enter" ? -1 : 1), col: cell.col };
    else if (e.key === "ArrowUp") next = { row: cell.row - 1, col: cell.col };
    else if (e.key === "ArrowLeft" && selectionStart === 0 && selectionEnd === 0 && c > 0) next = { row: cell.row, col: columns[c - 1] };
    else if (e.key === "ArrowRight" && selectionStart === value.length && c < columns.length - 1) next = { row: cell.row, col: columns[c + 1] };
    if (!next) return;
    e.preventDefault();
    commitCell(cell.input, cell.row, cell.col);
    if (next.row >= labels.length && e.key === "Enter") {
      document.querySelector<HTMLElement>(`[data-grid-after="${gridId}"]`)?.focus();
      return;
    }
    if (next.row >= 0 && next.row < labels.length) focusCell(next.row, next.col);
  };

  const onPaste = (e: React.ClipboardEvent) => {
    const cell = cellOf(e.target);
    const text = e.clipboardData.getData("text/plain");
    if (!cell || !isBlock(text)) return;
    e.preventDefault();
    const plan = planPaste(parseBlock(text), { row: cell.row, column: cell.col }, { labels, columns });
    record();
    for (const w of plan.writes) form.setValue(`rows.${w.row}.${w.column as CellColumn}`, parseCell(w.text), { shouldDirty: true });
    atFocus.current = cell.input.value;
    const rowsTouched = [...new Set(plan.writes.map((w) => w.row + 1))];
    const parts = [`Pasted ${plan.writes.length} value${plan.writes.length === 1 ? "" : "s"}${plan.byLabel ? ", matched by setting label," : ""} into ${rowsTouched.length} row${rowsTouched.length === 1 ? "" : "s"}.`];
    if (plan.unknownLabels.length) parts.push(`Not in this set, left out: ${plan.unknownLabels.join(", ")}.`);
    if (plan.dropped && !plan.unknownLabels.length) parts.push(`${plan.dropped} value${plan.dropped === 1 ? "" : "s"} fell outside the grid and were left out.`);
    parts.push("Ctrl-Z undoes the paste.");
    setAnnouncement(parts.join(" "));
  };

  return { onFocus, onBlur, onKeyDown, onPaste, record, announcement, setAnnouncement, clearHistory: () => history.current.clear() };
}
