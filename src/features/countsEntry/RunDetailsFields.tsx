import type { UseFormReturn } from "react-hook-form";
import { Field, fieldProps, inputClass } from "../../components/Field";
import { Panel } from "../../components/Panel";
import { LaserCaution } from "../labSessions/SafetyNotes";
import { parseCell } from "./clipboard";
import type { RunFormValues } from "./runForm";

const optionalNumber = (v: unknown) => (typeof v === "string" ? (parseCell(v) ?? null) : v);

/** Name, notes and the conditions that vary between runs of a session (the x-axis of trends). */
export function RunDetailsFields({ form }: { form: UseFormReturn<RunFormValues, unknown, unknown> }) {
  const { register, formState } = form;
  const e = formState.errors;
  return (
    <Panel title="This run">
      <div className="grid gap-4 md:grid-cols-[2fr_1fr_1fr_1fr]">
        <Field label="Run name" error={e.name?.message} hint="What tells it apart, e.g. “5 mW” or “tilt 12°”.">
          {(p) => <input {...register("name")} {...fieldProps(p)} className={inputClass} autoComplete="off" />}
        </Field>
        <Field label="Pump power" unit="mW" error={e.conditions?.pumpPowerMw?.message}>
          {(p) => <input {...register("conditions.pumpPowerMw", { setValueAs: optionalNumber })} {...fieldProps(p)} inputMode="decimal" className={`${inputClass} text-right`} />}
        </Field>
        <Field label="Crystal temperature" unit="°C" error={e.conditions?.crystalTemperatureC?.message}>
          {(p) => <input {...register("conditions.crystalTemperatureC", { setValueAs: optionalNumber })} {...fieldProps(p)} inputMode="decimal" className={`${inputClass} text-right`} />}
        </Field>
        <Field label="Compensator tilt" unit="°" error={e.conditions?.compensatorTiltDeg?.message}>
          {(p) => <input {...register("conditions.compensatorTiltDeg", { setValueAs: optionalNumber })} {...fieldProps(p)} inputMode="decimal" className={`${inputClass} text-right`} />}
        </Field>
      </div>
      <div className="mt-3">
        <LaserCaution compact />
      </div>
      <Field label="Notes" className="mt-3" error={e.notes?.message}>
        {(p) => <textarea {...register("notes")} {...fieldProps(p)} rows={2} className={inputClass} />}
      </Field>
    </Panel>
  );
}
