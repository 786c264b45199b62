import type { UseFormReturn } from "react-hook-form";
import { Panel } from "../../components/Panel";
import { parseCell } from "../countsEntry/clipboard";
import type { SessionFormValues } from "./SessionSetupForm";

const PLATES = [
  { key: "qwp", name: "QWP" },
  { key: "hwp", name: "HWP" },
] as const;

const toNumber = (v: unknown) => (typeof v === "string" ? (parseCell(v) ?? 0) : v);

/**
 * Waveplate calibrations per arm and the circular handedness. With calibrations set, the counts
 * grid shows the angles that make these real plates analyse the wanted states.
 */
export function CalibrationFields({ form }: { form: UseFormReturn<SessionFormValues> }) {
  const { register, formState } = form;
  const errors = formState.errors.calibration;
  return (
    <Panel title="Analysers and conventions">
      <p className="text-sm text-ink-soft">
        Each arm: quarter-wave plate, then half-wave plate, then a polarising beam splitter. Enter how far each plate's true fast axis sits from its mount's zero,
        and how far its retardance is from nominal (90° for a QWP, 180° for a HWP). Leave zeros for ideal plates.
      </p>
      <table className="mt-3 text-sm">
        <thead>
          <tr className="text-ink-soft">
            <th scope="col" className="px-2 text-left">Plate</th>
            <th scope="col" className="px-2 text-right">Fast-axis offset (°)</th>
            <th scope="col" className="px-2 text-right">Retardance error (°)</th>
          </tr>
        </thead>
        <tbody>
          {[0, 1].flatMap((arm) =>
            PLATES.map((plate) => {
              const err = errors?.[arm]?.[plate.key];
              const label = `Arm ${arm === 0 ? "A" : "B"} ${plate.name}`;
              return (
                <tr key={`${arm}-${plate.key}`} className="border-t border-paper-sunk">
                  <th scope="row" className="px-2 py-1 text-left font-bold">
                    {label}
                  </th>
                  {(["fastAxisOffsetDeg", "retardanceErrorDeg"] as const).map((f) => (
                    <td key={f} className="px-2 py-1 text-right">
                      <input
                        {...register(`calibration.${arm}.${plate.key}.${f}`, { setValueAs: toNumber })}
                        aria-label={`${label}, ${f === "fastAxisOffsetDeg" ? "fast-axis offset" : "retardance error"} in degrees`}
                        aria-invalid={!!err?.[f]}
                        inputMode="decimal"
                        className="w-24 rounded border border-ink-faint px-2 py-1 text-right tabular-nums aria-[invalid=true]:border-danger"
                      />
                      {err?.[f]?.message && <p className="text-xs font-bold text-danger">{err[f]!.message}</p>}
                    </td>
                  ))}
                </tr>
              );
            }),
          )}
        </tbody>
      </table>
      <fieldset className="mt-4">
        <legend className="text-sm font-bold">Circular handedness</legend>
        <label className="mt-1 flex items-center gap-2 text-sm">
          <input type="radio" value="R=H+iV" {...register("handedness")} /> |R⟩ = (|H⟩ + i|V⟩)/√2
        </label>
        <label className="mt-1 flex items-center gap-2 text-sm">
          <input type="radio" value="R=H-iV" {...register("handedness")} /> |R⟩ = (|H⟩ − i|V⟩)/√2 (swaps R and L; flips the sign of Im ρ)
        </label>
      </fieldset>
    </Panel>
  );
}
