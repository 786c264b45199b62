import { useMemo, useState } from "react";
import { useNavigate } from "react-router-dom";
import { fringeScanSettings } from "@shared/physics/bell";
import { type FringeFit, fitFringe } from "@shared/physics/fringe";
import { CreateRunSchema } from "@shared/schemas/runs";
import { ApiError } from "../../api/client";
import { useCreateRun } from "../../api/runs";
import { Alert } from "../../components/Alert";
import { Button } from "../../components/Button";
import { Field, inputClass } from "../../components/Field";
import { Panel } from "../../components/Panel";
import { ValueWithError } from "../../components/ValueWithError";
import { labPaths } from "../notebook/labPaths";
import { checkCount, pastedGrid } from "../bell/countsCells";

interface ScanDraft {
  fixedDeg: string;
  /** [θ, counts] per row, as typed. */
  cells: string[][];
}

const DEFAULT_ANGLES = Array.from({ length: 18 }, (_, i) => String(i * 10));
const newScan = (fixedDeg: string): ScanDraft => ({ fixedDeg, cells: DEFAULT_ANGLES.map((a) => [a, ""]) });
const FIXED_CHOICES = [
  { deg: "0", label: "H (0°)" },
  { deg: "45", label: "D (45°)" },
  { deg: "90", label: "V (90°)" },
  { deg: "135", label: "A (135°)" },
];

/**
 * Typing or pasting fringe scans: arm A fixed (H, D, … or any angle), arm B's polariser angle θ
 * and the counts per row; one or more scans per run. Paste two columns (θ, counts) or one
 * (counts). Each scan's visibility is fitted in the browser as the cells fill.
 */
export function FringeEntryForm({ labId, sessionId }: { labId: string; sessionId: string }) {
  const navigate = useNavigate();
  const create = useCreateRun(labId, sessionId);
  const [name, setName] = useState("Fringe scans");
  const [seconds, setSeconds] = useState("1");
  const [scans, setScans] = useState<ScanDraft[]>([newScan("0")]);
  const [serverErrors, setServerErrors] = useState<Record<string, string>>({});
  const exposure = Number(seconds);
  const exposureError = Number.isFinite(exposure) && exposure > 0 ? undefined : "Exposure must be above 0 s.";

  const parsed = scans.map((scan) => {
    const fixed = Number(scan.fixedDeg);
    const rows = scan.cells.map(([theta, counts]) => ({ theta: theta.trim() === "" ? null : Number(theta), check: checkCount(counts) }));
    const filled = rows.filter((r) => r.theta !== null && Number.isFinite(r.theta) && "value" in r.check).map((r) => ({ angleDeg: r.theta!, counts: (r.check as { value: number }).value }));
    return { fixed, rows, filled, fixedError: Number.isFinite(fixed) ? undefined : "An angle in degrees." };
  });
  const fits = useMemo(
    () =>
      parsed.map((p): { fit?: FringeFit; error?: string } => {
        if (p.filled.length < 4 || exposureError) return {};
        try {
          return { fit: fitFringe(p.filled.map((f) => ({ ...f, seconds: exposure }))) };
        } catch (e) {
          return { error: (e as Error).message };
        }
      }),
    [JSON.stringify(parsed.map((p) => p.filled)), exposure],
  );
  const bad = parsed.some((p) => p.fixedError || p.rows.some((r) => "error" in r.check || (r.theta !== null && !Number.isFinite(r.theta))));
  const total = parsed.reduce((n, p) => n + p.filled.length, 0);

  const save = (e: React.FormEvent) => {
    e.preventDefault();
    setServerErrors({});
    const rows = parsed.flatMap((p) => p.filled.map((f) => ({ setting: fringeScanSettings(p.fixed, [f.angleDeg])[0], counts: f.counts, seconds: exposure })));
    const body = CreateRunSchema.safeParse({ kind: "fringe", settingSetId: "custom", name, rows });
    if (!body.success) return setServerErrors(Object.fromEntries(body.error.issues.map((i) => [i.path.join("."), i.message])));
    create.mutate(body.data, {
      onSuccess: (run) => navigate(labPaths.fringeFit(labId, run.id)),
      onError: (err) => setServerErrors(err instanceof ApiError ? err.fieldMessages() : {}),
    });
  };

  const update = (i: number, next: Partial<ScanDraft>) => setScans(scans.map((s, k) => (k === i ? { ...s, ...next } : s)));
  return (
    <form onSubmit={save} noValidate className="space-y-4">
      <Panel title="Run">
        <div className="grid gap-3 sm:grid-cols-2 lg:w-2/3">
          <Field label="Run name" error={serverErrors.name}>
            {({ id, describedBy, invalid }) => <input id={id} className={inputClass} aria-describedby={describedBy} aria-invalid={invalid} value={name} onChange={(e) => setName(e.target.value)} />}
          </Field>
          <Field label="Exposure per angle" unit="s" error={exposureError}>
            {({ id, describedBy, invalid }) => <input id={id} inputMode="decimal" className={`${inputClass} text-right`} aria-describedby={describedBy} aria-invalid={invalid} value={seconds} onChange={(e) => setSeconds(e.target.value)} />}
          </Field>
        </div>
      </Panel>
      <div className="grid gap-4 lg:grid-cols-2">
        {scans.map((scan, i) => (
          <Panel key={i} title={`Scan ${i + 1}`} actions={scans.length > 1 ? <Button variant="quiet" size="sm" onClick={() => setScans(scans.filter((_, k) => k !== i))}>Remove</Button> : undefined}>
            <Field className="max-w-56" label="Arm A fixed at" unit="°" error={parsed[i].fixedError} hint={FIXED_CHOICES.map((c) => c.label).join(", ")}>
              {({ id, describedBy, invalid }) => (
                <input id={id} inputMode="decimal" list="fringe-fixed-angles" className={`${inputClass} text-right`} aria-describedby={describedBy} aria-invalid={invalid} value={scan.fixedDeg} onChange={(e) => update(i, { fixedDeg: e.target.value })} />
              )}
            </Field>
            <table className="mt-3 text-sm">
              <thead>
                <tr>
                  <th scope="col" className="px-2 py-1 text-right text-ink-soft">Arm B angle θ (°)</th>
                  <th scope="col" className="px-2 py-1 text-right text-ink-soft">Counts</th>
                </tr>
              </thead>
              <tbody>
                {scan.cells.map((row, r) => {
                  const check = parsed[i].rows[r].check;
                  return (
                    <tr key={r}>
                      {row.map((text, c) => (
                        <td key={c} className="px-1 py-0.5">
                          <input
                            aria-label={c === 0 ? `Scan ${i + 1}, row ${r + 1}: angle θ` : `Scan ${i + 1}, row ${r + 1}: counts`}
                            aria-invalid={c === 1 && "error" in check}
                            inputMode="decimal"
                            className={`${inputClass} w-28 text-right tabular-nums`}
                            value={text}
                            onChange={(e) => update(i, { cells: scan.cells.map((cells, k) => (k === r ? cells.map((v, j) => (j === c ? e.target.value : v)) : cells)) })}
                            onPaste={(e) => {
                              const next = pastedGrid(scan.cells, r, c, e.clipboardData.getData("text"));
                              if (next) {
                                e.preventDefault();
                                update(i, { cells: next });
                              }
                            }}
                          />
                        </td>
                      ))}
                    </tr>
                  );
                })}
              </tbody>
            </table>
            <div className="mt-2 flex flex-wrap items-center gap-3">
              <Button variant="secondary" size="sm" onClick={() => update(i, { cells: [...scan.cells, ["", ""]] })}>
                Add a row
              </Button>
              <p className="text-sm" aria-live="polite">
                {fits[i].fit ? (
                  <>
                    V = <strong className="tabular-nums"><ValueWithError value={fits[i].fit!.visibility} uncertainty={fits[i].fit!.sigmaVisibility} /></strong> (fit, no background)
                  </>
                ) : fits[i].error ? (
                  <span className="text-caution">{fits[i].error}</span>
                ) : (
                  <span className="text-ink-soft">V appears once four rows are filled.</span>
                )}
              </p>
            </div>
          </Panel>
        ))}
      </div>
      <datalist id="fringe-fixed-angles">
        {FIXED_CHOICES.map((c) => <option key={c.deg} value={c.deg} label={c.label} />)}
      </datalist>
      <Button variant="secondary" onClick={() => setScans([...scans, newScan(scans.length === 1 ? "45" : "0")])}>
        Add a scan (another setting of arm A)
      </Button>
      {bad && <Alert kind="caution">Angles are numbers of degrees and counts whole numbers ≥ 0; fix the marked cells. Empty rows are left out.</Alert>}
      {Object.keys(serverErrors).length > 0 && (
        <Alert kind="error" title="The run was not saved">
          {Object.entries(serverErrors).map(([f, m]) => `${f}: ${m}`).join(" ")} Nothing was stored; your entries are still here.
        </Alert>
      )}
      {create.isError && !Object.keys(serverErrors).length && <Alert kind="error" title="The run was not saved">{create.error.message}</Alert>}
      <Button type="submit" disabled={bad || total < 3 || !!exposureError || create.isPending}>
        {create.isPending ? "Saving…" : `Save ${total} rows`}
      </Button>
    </form>
  );
}
