import { useMemo, useState } from "react";
import { useNavigate } from "react-router-dom";
import { type BellAngles, STANDARD_BELL_ANGLES, bellTestSettings, chshFromRows, settingPairs } from "@shared/physics/bell";
import { CreateRunSchema } from "@shared/schemas/runs";
import { ApiError } from "../../api/client";
import { useCreateRun } from "../../api/runs";
import { Alert } from "../../components/Alert";
import { Button } from "../../components/Button";
import { Field, inputClass } from "../../components/Field";
import { Panel } from "../../components/Panel";
import { ValueWithError } from "../../components/ValueWithError";
import { labPaths } from "../notebook/labPaths";
import { BellAnglesForm } from "./BellAnglesForm";
import { checkCount, pastedGrid } from "./countsCells";

const OUTCOMES = ["C(α, β)", "C(α⊥, β⊥)", "C(α, β⊥)", "C(α⊥, β)"];
const PAIR_LABEL = ["(a, b)", "(a, b′)", "(a′, b)", "(a′, b′)"];
const deg = (x: number) => `${Math.round((((x % 180) + 180) % 180) * 1000) / 1000}°`;

/**
 * Typing or pasting a Bell test: the four analyser pairs of the CHSH sum, each with its four
 * outcomes (the grid's row k, column o is the run's row 4k + o). S ± σ_S is computed in the
 * browser as the cells fill, with the same code the server uses.
 */
export function BellEntryForm({ labId, sessionId }: { labId: string; sessionId: string }) {
  const navigate = useNavigate();
  const create = useCreateRun(labId, sessionId);
  const [name, setName] = useState("CHSH");
  const [seconds, setSeconds] = useState("1");
  const [angles, setAngles] = useState<BellAngles>({ ...STANDARD_BELL_ANGLES });
  const [grid, setGrid] = useState<string[][]>(() => Array.from({ length: 4 }, () => ["", "", "", ""]));
  const [serverErrors, setServerErrors] = useState<Record<string, string>>({});
  const checks = grid.map((r) => r.map(checkCount));
  const exposure = Number(seconds);
  const exposureError = Number.isFinite(exposure) && exposure > 0 ? undefined : "Exposure must be above 0 s.";
  const complete = checks.every((r) => r.every((c) => "value" in c)) && !exposureError;
  const counts = checks.flat().map((c) => ("value" in c ? c.value : 0));

  const preview = useMemo(() => {
    if (!complete) return null;
    try {
      const rows = settingPairs(angles).flatMap(({ alphaDeg: a, betaDeg: b }, p) =>
        [[a, b], [a + 90, b + 90], [a, b + 90], [a + 90, b]].map(([x, y], o) => ({ angleADeg: x, angleBDeg: y, counts: counts[p * 4 + o], seconds: exposure })),
      );
      return { result: chshFromRows(rows, angles) };
    } catch (e) {
      return { error: (e as Error).message };
    }
  }, [complete, angles, exposure, counts.join(",")]);

  const save = (e: React.FormEvent) => {
    e.preventDefault();
    setServerErrors({});
    const parsed = CreateRunSchema.safeParse({
      kind: "bell",
      settingSetId: "custom",
      name,
      rows: bellTestSettings(angles).map((setting, i) => ({ setting, counts: counts[i], seconds: exposure })),
    });
    if (!parsed.success) {
      setServerErrors(Object.fromEntries(parsed.error.issues.map((i) => [i.path.join("."), i.message])));
      return;
    }
    const search = `?a=${angles.aDeg}&a2=${angles.aPrimeDeg}&b=${angles.bDeg}&b2=${angles.bPrimeDeg}`;
    create.mutate(parsed.data, {
      onSuccess: (run) => navigate(`${labPaths.bellTest(labId, run.id)}${search}`),
      onError: (err) => setServerErrors(err instanceof ApiError ? err.fieldMessages() : {}),
    });
  };

  const pairs = settingPairs(angles);
  return (
    <div className="space-y-4">
      <Panel title="Analyser angles">
        <BellAnglesForm angles={angles} applyLabel="Use these angles" onApply={(a) => setAngles(a ?? { ...STANDARD_BELL_ANGLES })} />
      </Panel>
      <form onSubmit={save} noValidate className="space-y-4">
        <Panel title="Coincidences">
          <div className="mb-3 grid gap-3 sm:grid-cols-2 lg:w-2/3">
            <Field label="Run name" error={serverErrors.name}>
              {({ id, describedBy, invalid }) => <input id={id} className={inputClass} aria-describedby={describedBy} aria-invalid={invalid} value={name} onChange={(e) => setName(e.target.value)} />}
            </Field>
            <Field label="Exposure per setting" unit="s" error={exposureError}>
              {({ id, describedBy, invalid }) => <input id={id} inputMode="decimal" className={`${inputClass} text-right`} aria-describedby={describedBy} aria-invalid={invalid} value={seconds} onChange={(e) => setSeconds(e.target.value)} />}
            </Field>
          </div>
          <p className="mb-2 text-sm text-ink-soft">Type the counts, or paste a 4 × 4 block from a spreadsheet into the first cell. α⊥ = α + 90° is the other PBS port (or the polariser turned by 90°).</p>
          <div className="overflow-x-auto">
            <table className="text-sm">
              <thead>
                <tr>
                  <th scope="col" className="px-2 py-1 text-left text-ink-soft">Pair (α, β)</th>
                  {OUTCOMES.map((o) => (
                    <th key={o} scope="col" className="px-2 py-1 text-right text-ink-soft">
                      {o}
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {pairs.map((p, r) => (
                  <tr key={p.name}>
                    <th scope="row" className="px-2 py-1 text-left font-bold">
                      {PAIR_LABEL[r]} <span className="font-normal text-ink-soft">A {deg(p.alphaDeg)}, B {deg(p.betaDeg)}</span>
                    </th>
                    {grid[r].map((text, c) => {
                      const check = checks[r][c];
                      const error = "error" in check ? check.error : serverErrors[`rows.${r * 4 + c}.counts`];
                      const outcome = [[p.alphaDeg, p.betaDeg], [p.alphaDeg + 90, p.betaDeg + 90], [p.alphaDeg, p.betaDeg + 90], [p.alphaDeg + 90, p.betaDeg]][c];
                      return (
                        <td key={c} className="px-1 py-1">
                          <input
                            aria-label={`Counts at A ${deg(outcome[0])}, B ${deg(outcome[1])}`}
                            aria-invalid={!!error}
                            title={error}
                            inputMode="numeric"
                            className={`${inputClass} w-28 text-right tabular-nums`}
                            value={text}
                            onChange={(e) => setGrid(grid.map((row, i) => (i === r ? row.map((v, j) => (j === c ? e.target.value : v)) : row)))}
                            onPaste={(e) => {
                              const next = pastedGrid(grid, r, c, e.clipboardData.getData("text"));
                              if (next) {
                                e.preventDefault();
                                setGrid(next);
                              }
                            }}
                          />
                        </td>
                      );
                    })}
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          {checks.flat().some((c) => "error" in c) && <p className="mt-2 text-sm font-bold text-danger">Counts are whole numbers ≥ 0; the marked cells are not.</p>}
        </Panel>
        <Panel title="Preview">
          {!preview && <p className="text-ink-soft">S appears here once all sixteen cells are filled.</p>}
          {preview?.error && <Alert kind="caution">{preview.error}</Alert>}
          {preview?.result && (
            <p className="text-lg">
              S = <strong className="tabular-nums"><ValueWithError value={preview.result.s} uncertainty={preview.result.sigmaS} /></strong>; (|S| − 2)/σ_S ={" "}
              <strong className="tabular-nums"><ValueWithError value={preview.result.significance} significant={3} /></strong>
            </p>
          )}
        </Panel>
        {create.isError && (
          <Alert kind="error" title="The run was not saved">
            {create.error.message} Nothing was stored; your entries are still here.
          </Alert>
        )}
        <Button type="submit" disabled={!complete || create.isPending}>
          {create.isPending ? "Saving…" : "Save the Bell test"}
        </Button>
      </form>
    </div>
  );
}
