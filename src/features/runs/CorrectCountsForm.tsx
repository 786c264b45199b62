import { useState } from "react";
import { CreateRevisionSchema, type RunDetailDto } from "@shared/schemas/runs";
import { ApiError } from "../../api/client";
import { useCreateRevision } from "../../api/runs";
import { Alert } from "../../components/Alert";
import { Button } from "../../components/Button";
import { Field, fieldProps, inputClass } from "../../components/Field";
import { parseCell } from "../countsEntry/clipboard";
import { settingText } from "./RawCounts";

type Column = "counts" | "seconds" | "singlesA" | "singlesB";
type Cells = Record<Column, string>;

const text = (x: number | null) => (x === null ? "" : String(x));
const cellValue = (s: string) => {
  const v = parseCell(s);
  return v === undefined ? null : v;
};

/**
 * Corrects a run's counts without altering them: the edited table is stored as a new revision
 * with a reason, the earlier revision is kept, and the run is reconstructed again.
 */
export function CorrectCountsForm({ labId, run, onDone }: { labId: string; run: RunDetailDto; onDone: () => void }) {
  const revise = useCreateRevision(labId, run.id);
  const hasSingles = run.rows.some((r) => r.singlesA !== null || r.singlesB !== null);
  const columns: Column[] = hasSingles ? ["counts", "seconds", "singlesA", "singlesB"] : ["counts", "seconds"];
  const [cells, setCells] = useState<Cells[]>(() => run.rows.map((r) => ({ counts: text(r.counts), seconds: text(r.seconds), singlesA: text(r.singlesA), singlesB: text(r.singlesB) })));
  const [reason, setReason] = useState("");
  const [errors, setErrors] = useState<Record<string, string>>({});

  const changed = cells.filter((c, i) => columns.some((col) => c[col] !== text(run.rows[i][col]))).length;
  const setCell = (i: number, col: Column, value: string) => setCells((all) => all.map((c, j) => (j === i ? { ...c, [col]: value } : c)));

  const submit = async (e: React.FormEvent) => {
    e.preventDefault();
    const body = {
      reason,
      rows: run.rows.map((r, i) => ({
        setting: r.setting,
        counts: cellValue(cells[i].counts),
        seconds: cellValue(cells[i].seconds) ?? 1,
        singlesA: hasSingles ? cellValue(cells[i].singlesA) : null,
        singlesB: hasSingles ? cellValue(cells[i].singlesB) : null,
        monitor: r.monitor,
      })),
    };
    const parsed = CreateRevisionSchema.safeParse(body);
    if (!parsed.success) {
      setErrors(Object.fromEntries(parsed.error.issues.map((issue) => [issue.path.join("."), issue.message])));
      return;
    }
    setErrors({});
    try {
      await revise.mutateAsync(parsed.data);
      onDone();
    } catch (err) {
      if (err instanceof ApiError) setErrors(err.fieldMessages());
    }
  };

  // Enter moves down the same column, as in the entry grid.
  const onKeyDown = (e: React.KeyboardEvent<HTMLInputElement>, i: number, col: Column) => {
    if (e.key !== "Enter") return;
    e.preventDefault();
    document.getElementById(`fix-${i + (e.shiftKey ? -1 : 1)}-${col}`)?.focus();
  };

  const rowErrors = Object.entries(errors).filter(([k]) => k.startsWith("rows."));
  return (
    <form onSubmit={submit} noValidate className="space-y-3 text-sm">
      <p className="text-ink-soft">
        Edit the cells that were mistyped. The counts as first entered stay stored as revision {run.revisionNumber}; this becomes revision {run.revisionNumber + 1}, with your name, the time and
        the reason, and the run is reconstructed again.
      </p>
      <div className="max-h-[28rem] overflow-auto rounded-md border border-paper-sunk">
        <table className="w-full text-sm">
          <caption className="sr-only">Corrected counts</caption>
          <thead className="sticky top-0 bg-paper-sunk text-left">
            <tr>
              <th className="px-2 py-1">Setting</th>
              {columns.map((col) => (
                <th key={col} className="px-2 py-1 text-right">
                  {{ counts: "Coincidences", seconds: "Exposure (s)", singlesA: "Singles A", singlesB: "Singles B" }[col]}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {run.rows.map((r, i) => (
              <tr key={i} className="border-t border-paper-sunk">
                <th scope="row" className="px-2 py-1 text-left font-normal">
                  {settingText(r.setting)}
                </th>
                {columns.map((col) => {
                  const error = errors[`rows.${i}.${col}`];
                  const edited = cells[i][col] !== text(r[col]);
                  return (
                    <td key={col} className="px-1 py-0.5">
                      <input
                        id={`fix-${i}-${col}`}
                        aria-label={`${settingText(r.setting)} ${col}`}
                        aria-invalid={!!error}
                        title={error}
                        inputMode="decimal"
                        value={cells[i][col]}
                        onChange={(e) => setCell(i, col, e.target.value)}
                        onKeyDown={(e) => onKeyDown(e, i, col)}
                        className={`${inputClass} num ${edited ? "border-petrol-500 font-bold" : ""}`}
                      />
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {rowErrors.length > 0 && (
        <Alert kind="error" title="Some cells are not valid; nothing was saved">
          <ul className="list-disc pl-5">
            {rowErrors.map(([field, message]) => (
              <li key={field}>
                Row {Number(field.split(".")[1]) + 1}: {message}
              </li>
            ))}
          </ul>
        </Alert>
      )}
      <Field label="Reason for the correction" error={errors.reason} hint="For example: HV typed as 8120 instead of 812 (checked against the counter's log).">
        {(p) => <input {...fieldProps(p)} value={reason} onChange={(e) => setReason(e.target.value)} className={inputClass} />}
      </Field>
      {revise.error && !(revise.error instanceof ApiError && Object.keys(revise.error.fieldMessages()).length) && (
        <Alert kind="error" title="The correction was not saved">
          {revise.error.message}
        </Alert>
      )}
      <div className="flex items-center gap-2">
        <Button type="submit" disabled={revise.isPending || changed === 0}>
          {revise.isPending ? "Saving and reconstructing…" : `Save ${changed} changed row${changed === 1 ? "" : "s"} as a new revision`}
        </Button>
        <Button variant="quiet" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
