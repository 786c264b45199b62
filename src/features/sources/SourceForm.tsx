import { useForm, type Resolver } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { CreateSourceSchema, type CreateSource } from "@shared/schemas/sources";
import { ApiError } from "../../api/client";
import { Alert } from "../../components/Alert";
import { Button } from "../../components/Button";
import { Field, fieldProps, inputClass } from "../../components/Field";
import { parseCell } from "../countsEntry/clipboard";
import { LaserCaution } from "../labSessions/SafetyNotes";
import { BELL_SYMBOL } from "../stateView/meritRows";

const resolver = zodResolver(CreateSourceSchema) as unknown as Resolver<CreateSource>;
const EMPTY: CreateSource = { name: "", crystal: "", pumpLaser: "", wavelengthNm: null, targetState: "psi-", notes: "" };

/** A pair source: what it is and which Bell state it aims at (fidelities are quoted to it). */
export function SourceForm({ initial = EMPTY, submitLabel, onSubmit, pending, error }: { initial?: CreateSource; submitLabel: string; onSubmit: (v: CreateSource) => Promise<unknown>; pending: boolean; error: Error | null }) {
  const form = useForm<CreateSource>({ defaultValues: initial, resolver });
  const { register, formState } = form;
  const e = formState.errors;
  const submit = form.handleSubmit(async (values) => {
    try {
      await onSubmit(values);
      if (initial === EMPTY) form.reset(EMPTY);
    } catch (err) {
      if (err instanceof ApiError) for (const [field, message] of Object.entries(err.fieldMessages())) form.setError(field as never, { message });
    }
  });
  return (
    <form onSubmit={submit} noValidate className="space-y-3">
      <div className="grid gap-3 md:grid-cols-2">
        <Field label="Name" error={e.name?.message} hint="e.g. “Sagnac-2”">
          {(p) => <input {...register("name")} {...fieldProps(p)} className={inputClass} />}
        </Field>
        <Field label="Target state" error={e.targetState?.message} hint="Fidelities are quoted to this Bell state.">
          {(p) => (
            <select {...register("targetState")} {...fieldProps(p)} className={inputClass}>
              {(Object.keys(BELL_SYMBOL) as (keyof typeof BELL_SYMBOL)[]).map((b) => (
                <option key={b} value={b}>
                  {BELL_SYMBOL[b]} ({b})
                </option>
              ))}
            </select>
          )}
        </Field>
        <Field label="Crystal and geometry" error={e.crystal?.message} hint="e.g. “type-II ppKTP in a polarization Sagnac loop”">
          {(p) => <input {...register("crystal")} {...fieldProps(p)} className={inputClass} />}
        </Field>
        <Field label="Pair wavelength" unit="nm" error={e.wavelengthNm?.message}>
          {(p) => <input {...register("wavelengthNm", { setValueAs: (v) => (typeof v === "string" ? (parseCell(v) ?? null) : v) })} {...fieldProps(p)} inputMode="decimal" className={`${inputClass} text-right`} />}
        </Field>
        <Field label="Pump laser" error={e.pumpLaser?.message} hint="e.g. “405 nm CW diode laser”" className="md:col-span-2">
          {(p) => <input {...register("pumpLaser")} {...fieldProps(p)} className={inputClass} />}
        </Field>
      </div>
      <LaserCaution compact />
      <Field label="Notes" error={e.notes?.message}>
        {(p) => <textarea {...register("notes")} {...fieldProps(p)} rows={2} className={inputClass} />}
      </Field>
      {error && !(error instanceof ApiError && Object.keys(error.fieldMessages()).length) && (
        <Alert kind="error" title="Not saved">
          {error.message}
        </Alert>
      )}
      <Button type="submit" disabled={pending}>
        {pending ? "Saving…" : submitLabel}
      </Button>
    </form>
  );
}
