import type { FieldArrayWithId, UseFormReturn } from "react-hook-form";
import { formatCount, formatDecimal, formatNumber } from "@shared/format/uncertainty";
import { parseCell } from "./clipboard";
import type { EntryChecks } from "./entryChecks";
import type { ArmSetting, GridRow } from "./gridRows";
import type { CellColumn, RunFormValues } from "./runForm";
import type { useGridEditing } from "./useGridEditing";

const COLUMN_HEAD: Record<CellColumn, { title: string; unit?: string }> = {
  counts: { title: "Coincidences" },
  seconds: { title: "Exposure", unit: "s" },
  singlesA: { title: "Singles A" },
  singlesB: { title: "Singles B" },
};

const cellInput =
  "w-24 rounded border border-ink-faint bg-paper-raised px-2 py-1 text-right tabular-nums focus:border-petrol-700 aria-[invalid=true]:border-danger aria-[invalid=true]:bg-danger-soft";

/** The grid itself: one row per counted outcome, angles to turn on the left, inputs on the right. */
export function CountsTable({ form, fields, rows, columns, checks, editing, gridId, custom, onRemoveRow }: {
  form: UseFormReturn<RunFormValues, unknown, unknown>;
  fields: FieldArrayWithId<RunFormValues, "rows">[];
  rows: GridRow[];
  columns: CellColumn[];
  checks: EntryChecks;
  editing: ReturnType<typeof useGridEditing>;
  gridId: string;
  custom: boolean;
  onRemoveRow: (index: number) => void;
}) {
  const errors = form.formState.errors.rows;
  return (
    <div className="overflow-x-auto" data-grid={gridId} onKeyDown={editing.onKeyDown} onPaste={editing.onPaste} onFocus={editing.onFocus} onBlur={editing.onBlur}>
      <table className="w-full border-collapse text-sm">
        <caption className="sr-only">Counts per setting, with the waveplate angles to turn in each arm</caption>
        <thead>
          <tr className="text-ink-soft">
            <th scope="col" rowSpan={2} className="px-1.5 py-1 text-right">#</th>
            <th scope="col" rowSpan={2} className="px-1.5 py-1 text-left">Outcome</th>
            <th scope="colgroup" colSpan={2} className="border-b border-paper-sunk px-1.5 pt-1 text-center">Arm A</th>
            <th scope="colgroup" colSpan={2} className="border-b border-paper-sunk px-1.5 pt-1 text-center">Arm B</th>
            {columns.map((c) => (
              <th key={c} scope="col" rowSpan={2} className="px-1.5 py-1 text-right">
                {COLUMN_HEAD[c].title}
                {COLUMN_HEAD[c].unit && <span className="font-normal"> ({COLUMN_HEAD[c].unit})</span>}
              </th>
            ))}
            <th scope="col" rowSpan={2} className="px-1.5 py-1 text-left">Check</th>
          </tr>
          <tr className="text-xs text-ink-faint">
            <th scope="col" className="px-1.5 pb-1 text-right font-normal">QWP</th>
            <th scope="col" className="px-1.5 pb-1 text-right font-normal">HWP</th>
            <th scope="col" className="px-1.5 pb-1 text-right font-normal">QWP</th>
            <th scope="col" className="px-1.5 pb-1 text-right font-normal">HWP</th>
          </tr>
        </thead>
        <tbody>
          {fields.map((field, i) => {
            const row = rows[i];
            const messageId = `${gridId}-msg-${i}`;
            const rowErrors = errors?.[i];
            const note = rowNote(i, checks, rowErrors);
            return (
              <tr key={field.id} className={`border-t ${row?.startsSetting ? "border-paper-sunk" : "border-transparent"}`}>
                <td className="num px-1.5 py-0.5 text-ink-faint">{i + 1}</td>
                <th scope="row" className="px-1.5 py-0.5 text-left font-bold">
                  {custom ? (
                    <input
                      {...form.register(`rows.${i}.setting`)}
                      aria-label={`Outcome label, row ${i + 1}`}
                      aria-invalid={!!rowErrors?.setting}
                      aria-describedby={messageId}
                      placeholder="HD"
                      className="w-16 rounded border border-ink-faint px-2 py-1 uppercase aria-[invalid=true]:border-danger"
                    />
                  ) : (
                    row?.label
                  )}
                </th>
                {[0, 1].map((arm) => (
                  <AngleCells key={arm} arm={row?.arms[arm]} show={!!row?.startsSetting} />
                ))}
                {columns.map((c) => (
                  <td key={c} className="px-1.5 py-0.5 text-right">
                    <input
                      {...form.register(`rows.${i}.${c}`, { setValueAs: (v: unknown) => (typeof v === "string" ? parseCell(v) : v) })}
                      data-row={i}
                      data-col={c}
                      inputMode={c === "seconds" ? "decimal" : "numeric"}
                      autoComplete="off"
                      placeholder={c === "seconds" ? "1" : undefined}
                      aria-label={`${COLUMN_HEAD[c].title}, ${row?.label || `row ${i + 1}`}`}
                      aria-invalid={!!rowErrors?.[c]}
                      aria-describedby={messageId}
                      className={cellInput}
                    />
                  </td>
                ))}
                <td id={messageId} className="px-1.5 py-0.5 text-xs" aria-live="off">
                  {note && <span className={note.tone === "error" ? "font-bold text-danger" : "text-caution"}>{note.text}</span>}
                  {custom && (
                    <button type="button" className="ml-2 text-ink-faint underline hover:text-danger" onClick={() => onRemoveRow(i)} aria-label={`Remove row ${i + 1}`}>
                      remove
                    </button>
                  )}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}

function AngleCells({ arm, show }: { arm: ArmSetting | undefined; show: boolean }) {
  if (!show) {
    return (
      <td colSpan={2} className="px-1.5 py-0.5 text-center text-xs text-ink-faint">
        same setting
      </td>
    );
  }
  if (!arm) {
    return (
      <td colSpan={2} className="px-1.5 py-0.5 text-center text-xs text-ink-faint">
        —
      </td>
    );
  }
  const approx = arm.reach < 0.99999 ? "≈" : "";
  return (
    <>
      <td className="num px-1.5 py-0.5">
        {approx}
        {formatDecimal(arm.qwpDeg, 2)}°
      </td>
      <td className="num px-1.5 py-0.5" title={arm.reach < 0.99999 ? `These plates reach this state to ${formatNumber(arm.reach * 100, 4)} %` : undefined}>
        {approx}
        {formatDecimal(arm.hwpDeg, 2)}°{arm.port === "reflected" && <span className="ml-1 text-xs text-ink-faint">refl.</span>}
      </td>
    </>
  );
}

type RowErrors = NonNullable<UseFormReturn<RunFormValues>["formState"]["errors"]["rows"]>[number];

/** The most important thing to say about a row: a validation error, then the live checks. */
function rowNote(i: number, checks: EntryChecks, errors: RowErrors | undefined): { tone: "error" | "caution"; text: string } | null {
  const first = errors && (["setting", "counts", "seconds", "singlesA", "singlesB"] as const).map((k) => errors[k]?.message).find(Boolean);
  if (first) return { tone: "error", text: first };
  if (checks.unreadable.includes(i)) return { tone: "error", text: "not a whole number" };
  const outlier = checks.outliers.find((o) => o.row === i);
  if (outlier) return { tone: "caution", text: `far from the ${formatCount(outlier.expected)} the other rows imply` };
  if (checks.zeros.includes(i)) return { tone: "caution", text: "zero — detector on?" };
  return null;
}
