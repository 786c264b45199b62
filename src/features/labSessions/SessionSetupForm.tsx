import { useForm, type Resolver } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { CreateLabSessionSchema, type CreateLabSession, type LabSessionDto } from "@shared/schemas/labSessions";
import type { SourceDto } from "@shared/schemas/sources";
import { ApiError } from "../../api/client";
import { Alert } from "../../components/Alert";
import { Button } from "../../components/Button";
import { Field, fieldProps, inputClass } from "../../components/Field";
import { Panel } from "../../components/Panel";
import { parseCell } from "../countsEntry/clipboard";
import { CalibrationFields } from "./CalibrationFields";
import { DetectorCaution, LaserCaution } from "./SafetyNotes";

export type SessionFormValues = CreateLabSession;

const resolver = zodResolver(CreateLabSessionSchema) as unknown as Resolver<SessionFormValues>;
const optionalNumber = (v: unknown) => (typeof v === "string" ? (parseCell(v) ?? null) : v);
const peopleList = (v: unknown) => (typeof v === "string" ? v.split(",").map((s) => s.trim()).filter(Boolean) : v);

const IDEAL_PLATE = { fastAxisOffsetDeg: 0, retardanceErrorDeg: 0 };

export function sessionFormDefaults(session?: LabSessionDto, sourceId?: string): SessionFormValues {
  if (session) {
    const { id: _id, labId: _lab, source, runCount: _n, createdBy: _c, createdAt: _ca, updatedAt: _u, can: _can, ...fields } = session;
    return { ...fields, sourceId: source.id };
  }
  return {
    sourceId: sourceId ?? "",
    title: "",
    date: new Date().toISOString().slice(0, 10),
    people: [],
    pumpWavelengthNm: null,
    pumpPowerMw: null,
    crystalTemperatureC: null,
    coincidenceWindowNs: null,
    detectors: "",
    analyser: { arms: [{ bothPorts: false }, { bothPorts: false }] },
    calibration: [0, 1].map(() => ({ qwp: { ...IDEAL_PLATE }, hwp: { ...IDEAL_PLATE } })),
    handedness: "R=H+iV",
    notes: "",
    notesPrivate: false,
  };
}

/** The setup of a lab session: what was measured with what. Used to create and to edit. */
export function SessionSetupForm({ sources, initial, submitLabel, onSubmit, pending, error }: {
  sources: SourceDto[];
  initial: SessionFormValues;
  submitLabel: string;
  onSubmit: (values: CreateLabSession) => Promise<unknown>;
  pending: boolean;
  error: Error | null;
}) {
  const form = useForm<SessionFormValues>({ defaultValues: initial, resolver });
  const { register, formState } = form;
  const e = formState.errors;
  const submit = form.handleSubmit(async (values) => {
    try {
      await onSubmit(values);
    } catch (err) {
      if (err instanceof ApiError) for (const [field, message] of Object.entries(err.fieldMessages())) form.setError(field as never, { message });
    }
  });
  const num = (name: "pumpWavelengthNm" | "pumpPowerMw" | "crystalTemperatureC" | "coincidenceWindowNs") => register(name, { setValueAs: optionalNumber });
  return (
    <form onSubmit={submit} noValidate className="space-y-4">
      <Panel title="What and when">
        <div className="grid gap-4 md:grid-cols-3">
          <Field label="Source" error={e.sourceId?.message}>
            {(p) => (
              <select {...register("sourceId")} {...fieldProps(p)} className={inputClass}>
                <option value="">Choose a source…</option>
                {sources.map((s) => (
                  <option key={s.id} value={s.id}>
                    {s.name}
                  </option>
                ))}
              </select>
            )}
          </Field>
          <Field label="Title" error={e.title?.message} hint="e.g. “Pump power sweep”">
            {(p) => <input {...register("title")} {...fieldProps(p)} className={inputClass} />}
          </Field>
          <Field label="Date" error={e.date?.message}>
            {(p) => <input type="date" {...register("date")} {...fieldProps(p)} className={inputClass} />}
          </Field>
        </div>
        <Field label="People" className="mt-3" hint="Names, separated by commas." error={e.people?.message ?? (e.people as unknown as { [k: number]: { message?: string } })?.[0]?.message}>
          {(p) => <input {...register("people", { setValueAs: peopleList })} {...fieldProps(p)} className={inputClass} />}
        </Field>
      </Panel>
      <Panel title="Pump and crystal">
        <LaserCaution />
        <div className="mt-3 grid gap-4 md:grid-cols-3">
          <Field label="Pump wavelength" unit="nm" error={e.pumpWavelengthNm?.message}>
            {(p) => <input {...num("pumpWavelengthNm")} {...fieldProps(p)} inputMode="decimal" className={`${inputClass} text-right`} />}
          </Field>
          <Field label="Pump power" unit="mW" error={e.pumpPowerMw?.message} hint="Typical for the session; each run can give its own.">
            {(p) => <input {...num("pumpPowerMw")} {...fieldProps(p)} inputMode="decimal" className={`${inputClass} text-right`} />}
          </Field>
          <Field label="Crystal temperature" unit="°C" error={e.crystalTemperatureC?.message}>
            {(p) => <input {...num("crystalTemperatureC")} {...fieldProps(p)} inputMode="decimal" className={`${inputClass} text-right`} />}
          </Field>
        </div>
      </Panel>
      <Panel title="Detection">
        <DetectorCaution />
        <div className="mt-3 grid gap-4 md:grid-cols-3">
          <Field label="Detectors" error={e.detectors?.message} hint="e.g. “4 × Si APD”">
            {(p) => <input {...register("detectors")} {...fieldProps(p)} className={inputClass} />}
          </Field>
          <Field label="Coincidence window (full width)" unit="ns" error={e.coincidenceWindowNs?.message} hint="Used to estimate accidentals.">
            {(p) => <input {...num("coincidenceWindowNs")} {...fieldProps(p)} inputMode="decimal" className={`${inputClass} text-right`} />}
          </Field>
          <fieldset>
            <legend className="text-sm font-bold">Both PBS ports counted</legend>
            {(["A", "B"] as const).map((arm, i) => (
              <label key={arm} className="mt-1 flex items-center gap-2 text-sm">
                <input type="checkbox" {...register(`analyser.arms.${i}.bothPorts`)} /> Arm {arm}
              </label>
            ))}
          </fieldset>
        </div>
      </Panel>
      <CalibrationFields form={form} />
      <Panel title="Notes">
        <textarea {...register("notes")} aria-label="Notes" rows={3} className={inputClass} />
        <label className="mt-2 flex items-center gap-2 text-sm">
          <input type="checkbox" {...register("notesPrivate")} /> Keep these notes to lab members (never shown through a share)
        </label>
      </Panel>
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
