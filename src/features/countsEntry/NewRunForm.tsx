import { useDeferredValue, useId, useMemo, useState } from "react";
import { useFieldArray, useForm, useWatch } from "react-hook-form";
import { useNavigate } from "react-router-dom";
import type { LabSessionDto } from "@shared/schemas/labSessions";
import type { BellTarget } from "@shared/schemas/sources";
import { ApiError } from "../../api/client";
import { useCreateRun } from "../../api/runs";
import { Alert } from "../../components/Alert";
import { Button } from "../../components/Button";
import { Dialog } from "../../components/Dialog";
import { Panel } from "../../components/Panel";
import { SegmentedToggle } from "../../components/SegmentedToggle";
import { CountsTable } from "./CountsTable";
import { EntryFeedback } from "./EntryFeedback";
import { checkEntry } from "./entryChecks";
import { engineConventions, ENTRY_SETS, gridRows, type EntrySetId } from "./gridRows";
import { RunDetailsFields } from "./RunDetailsFields";
import { defaultRunForm, runFormResolver, switchRows, type CellColumn, type RunFormValues } from "./runForm";
import { SettingSheetPrint } from "./SettingSheetPrint";
import { labPaths } from "../notebook/labPaths";
import { useGridEditing, type Snapshot } from "./useGridEditing";

/** Counts entry for a new run: choose a set, read the angles, type or paste counts, save. */
export function NewRunForm({ labId, session, target }: { labId: string; session: LabSessionDto; target: BellTarget }) {
  const gridId = useId().replace(/:/g, "");
  const navigate = useNavigate();
  const createRun = useCreateRun(labId, session.id);
  const form = useForm<RunFormValues, unknown, unknown>({ defaultValues: defaultRunForm(), resolver: runFormResolver, mode: "onSubmit", reValidateMode: "onChange" });
  const { fields, replace, append, remove } = useFieldArray({ control: form.control, name: "rows" });
  const setId = useWatch({ control: form.control, name: "settingSetId" }) as EntrySetId;
  const watchedRows = useWatch({ control: form.control, name: "rows" });
  const [showSingles, setShowSingles] = useState(false);
  const [pendingSet, setPendingSet] = useState<{ id: EntrySetId; lost: string[] } | null>(null);

  const columns: CellColumn[] = showSingles ? ["counts", "seconds", "singlesA", "singlesB"] : ["counts", "seconds"];
  const labels = watchedRows.map((r) => (r.setting ?? "").toUpperCase());
  const rows = useMemo(() => gridRows(labels, setId, session), [labels.join(","), setId, session]);
  const deferred = useDeferredValue(watchedRows);
  const checks = useMemo(
    () => checkEntry(deferred.map((r) => ({ label: (r.setting ?? "").toUpperCase(), counts: r.counts, seconds: r.seconds })), engineConventions(setId, session), target),
    [deferred, setId, session, target],
  );

  const restore = (s: Snapshot) => {
    form.setValue("settingSetId", s.settingSetId);
    replace(s.rows);
  };
  const editing = useGridEditing({ form, columns, labels, restore, gridId });

  const applySet = (id: EntrySetId) => {
    editing.record();
    form.setValue("settingSetId", id);
    replace(switchRows(form.getValues("rows"), id).rows);
    setPendingSet(null);
  };
  const chooseSet = (id: EntrySetId) => {
    const { lost } = switchRows(form.getValues("rows"), id);
    if (lost.length) setPendingSet({ id, lost });
    else applySet(id);
  };

  const onSubmit = form.handleSubmit(
    async (body) => {
      try {
        const run = await createRun.mutateAsync(body as never);
        navigate(labPaths.run(labId, run.id));
      } catch (err) {
        if (err instanceof ApiError) for (const [field, message] of Object.entries(err.fieldMessages())) form.setError(field as never, { message });
      }
    },
    () => editing.setAnnouncement("Some cells need attention; each is marked in the Check column."),
  );

  const setLabel = ENTRY_SETS.find((s) => s.id === setId)!;
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <RunDetailsFields form={form} />
      <Panel
        title="Counts at the table"
        actions={
          <Button variant="secondary" size="sm" onClick={() => window.print()}>
            Print waveplate sheet
          </Button>
        }
      >
        <SegmentedToggle label="Setting set" options={ENTRY_SETS.map((s) => ({ value: s.id, label: s.label }))} value={setId} onChange={chooseSet} />
        <p className="mt-1 text-sm text-ink-soft">{setLabel.description}</p>
        <GridOptions form={form} showSingles={showSingles} setShowSingles={setShowSingles} rowCount={fields.length} record={editing.record} hasWindow={session.coincidenceWindowNs !== null} />
        <div className="mt-3 grid gap-4 xl:grid-cols-[1fr_20rem]">
          <div>
            <CountsTable form={form} fields={fields} rows={rows} columns={columns} checks={checks} editing={editing} gridId={gridId} custom={setId === "custom"} onRemoveRow={(i) => (editing.record(), remove(i))} />
            {setId === "custom" && (
              <Button variant="quiet" size="sm" className="mt-2" onClick={() => (editing.record(), append({ setting: "" }))}>
                + Add a row
              </Button>
            )}
            <p className="mt-2 text-xs text-ink-faint">
              Enter or ↓ goes to the next setting, ↑ back; ← → move between columns at the edge of a cell. Paste a column or a block from a spreadsheet into any cell
              (a first column of labels such as HV is matched by label). Ctrl-Z undoes, Ctrl-Shift-Z redoes.
            </p>
            <p className="sr-only" aria-live="polite">
              {editing.announcement}
            </p>
            {editing.announcement && <p className="mt-1 text-sm text-petrol-800">{editing.announcement}</p>}
          </div>
          <aside aria-label="Live check" className="rounded-md bg-paper p-3">
            <EntryFeedback checks={checks} labels={labels} target={target} />
          </aside>
        </div>
      </Panel>
      {createRun.isError && !(createRun.error instanceof ApiError && Object.keys(createRun.error.fieldMessages()).length) && (
        <Alert kind="error" title="The run was not saved">
          {createRun.error.message} Nothing was stored; your counts are still here.
        </Alert>
      )}
      <div className="flex items-center gap-3">
        <Button type="submit" data-grid-after={gridId} disabled={createRun.isPending}>
          {createRun.isPending ? "Saving and reconstructing…" : "Save and reconstruct"}
        </Button>
        {createRun.isPending && (
          <p className="text-sm text-ink-soft" role="status">
            Linear inversion, maximum likelihood and {form.getValues("reconstruction.monteCarloSamples")} Monte Carlo samples; this takes a few seconds.
          </p>
        )}
      </div>
      <SettingSheetPrint rows={rows} setName={setLabel.label} session={session} />
      <Dialog
        open={!!pendingSet}
        title="Switch setting set?"
        onClose={() => setPendingSet(null)}
        actions={
          <>
            <Button variant="secondary" onClick={() => setPendingSet(null)}>
              Keep the current set
            </Button>
            <Button onClick={() => pendingSet && applySet(pendingSet.id)}>Switch</Button>
          </>
        }
      >
        The new set has no row for {pendingSet?.lost.join(", ")}, so {pendingSet?.lost.length === 1 ? "that count" : `those ${pendingSet?.lost.length} counts`} would leave the
        grid. Ctrl-Z in the grid brings them back.
      </Dialog>
    </form>
  );
}

function GridOptions({ form, showSingles, setShowSingles, rowCount, record, hasWindow }: {
  form: ReturnType<typeof useForm<RunFormValues, unknown, unknown>>;
  showSingles: boolean;
  setShowSingles: (v: boolean) => void;
  rowCount: number;
  record: () => void;
  hasWindow: boolean;
}) {
  const [exposure, setExposure] = useState("");
  const applyExposure = () => {
    const t = Number(exposure);
    if (!(t > 0)) return;
    record();
    for (let i = 0; i < rowCount; i++) form.setValue(`rows.${i}.seconds`, t, { shouldDirty: true });
  };
  return (
    <div className="mt-3 flex flex-wrap items-end gap-x-6 gap-y-2 text-sm">
      <div className="flex items-end gap-2">
        <label className="block">
          <span className="font-bold">Same exposure for every row</span>
          <input value={exposure} onChange={(e) => setExposure(e.target.value)} inputMode="decimal" placeholder="1" className="ml-2 w-20 rounded border border-ink-faint px-2 py-1 text-right tabular-nums" />
          <span className="ml-1 text-ink-soft">s</span>
        </label>
        <Button variant="secondary" size="sm" onClick={applyExposure} disabled={!(Number(exposure) > 0)}>
          Fill the column
        </Button>
      </div>
      <label className="flex items-center gap-2">
        <input type="checkbox" checked={showSingles} onChange={(e) => setShowSingles(e.target.checked)} />
        Record singles (needed to subtract accidentals)
      </label>
      {showSingles && (
        <label className="flex items-center gap-2">
          <input type="checkbox" {...form.register("reconstruction.corrections.accidentals")} disabled={!hasWindow} />
          Subtract accidentals when reconstructing
          {!hasWindow && <span className="text-ink-faint">(set the session's coincidence window first)</span>}
        </label>
      )}
    </div>
  );
}
