import { useForm, type Resolver } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { CreateReconstructionSchema, type CreateReconstruction, type ReconstructionDto } from "@shared/schemas/reconstructions";
import type { RunDetailDto } from "@shared/schemas/runs";
import { ApiError } from "../../api/client";
import { useCreateReconstruction } from "../../api/reconstructions";
import { Alert } from "../../components/Alert";
import { Button } from "../../components/Button";
import { Field, fieldProps, inputClass } from "../../components/Field";
import { parseCell } from "../countsEntry/clipboard";
import { METHOD_NAME } from "../stateView/meritRows";

const resolver = zodResolver(CreateReconstructionSchema) as unknown as Resolver<CreateReconstruction>;
const optionalNumber = (v: unknown) => (typeof v === "string" ? (parseCell(v) ?? null) : v);
/** "1, 0.98, 1.02 …" (commas, spaces or newlines) → numbers; empty → null (all 1). */
const numberList = (v: unknown) => {
  if (typeof v !== "string") return v;
  const parts = v.split(/[\s,;]+/).filter(Boolean);
  return parts.length ? parts.map((p) => parseCell(p)) : null;
};

/**
 * Reconstruct the run's counts again with another method or other corrections. The raw counts
 * stay as they are; every result is stored beside the earlier ones.
 */
export function CorrectionsForm({ labId, run, current, sessionWindowNs, onCreated }: { labId: string; run: RunDetailDto; current: ReconstructionDto | undefined; sessionWindowNs: number | null; onCreated: (r: ReconstructionDto) => void }) {
  const create = useCreateReconstruction(labId, run.id);
  const hasSingles = run.rows.every((r) => r.singlesA !== null && r.singlesB !== null);
  const hasMonitor = run.rows.every((r) => r.monitor !== null);
  const form = useForm<CreateReconstruction>({
    resolver,
    defaultValues: {
      method: current?.method ?? "mle",
      corrections: { accidentals: hasSingles && (current?.corrections.accidentals ?? false), windowNs: current?.corrections.windowNs ?? null, efficiencies: current?.corrections.efficiencies ?? null, drift: current?.corrections.drift ?? "none" },
      monteCarloSamples: current?.uncertainties?.samples ?? 200,
    },
  });
  const { register, formState } = form;
  const e = formState.errors;
  const submit = form.handleSubmit(async (body) => {
    try {
      onCreated(await create.mutateAsync(body));
    } catch (err) {
      if (err instanceof ApiError) for (const [field, message] of Object.entries(err.fieldMessages())) form.setError(field as never, { message });
    }
  });
  return (
    <form onSubmit={submit} noValidate className="space-y-3 text-sm">
      <p className="text-ink-soft">The raw counts stay as they are; the new result is stored beside the earlier ones and shown at once.</p>
      <div className="grid gap-4 lg:grid-cols-3">
        <div className="space-y-3">
          <Field label="Method" error={e.method?.message}>
            {(p) => (
              <select {...register("method")} {...fieldProps(p)} className={inputClass}>
                {(Object.keys(METHOD_NAME) as (keyof typeof METHOD_NAME)[]).map((m) => (
                  <option key={m} value={m}>
                    {METHOD_NAME[m]}
                  </option>
                ))}
              </select>
            )}
          </Field>
          <Field label="Monte Carlo samples" error={e.monteCarloSamples?.message} hint="0 skips the uncertainties; up to 10,000.">
            {(p) => <input {...register("monteCarloSamples", { setValueAs: (v) => (typeof v === "string" ? parseCell(v) : v) })} {...fieldProps(p)} inputMode="numeric" className={`${inputClass} text-right`} />}
          </Field>
        </div>
        <fieldset className="rounded-md border border-paper-sunk p-3">
          <legend className="px-1 font-bold">Accidental coincidences</legend>
          <label className="flex items-center gap-2">
            <input type="checkbox" {...register("corrections.accidentals")} disabled={!hasSingles} /> Subtract accidentals, A = singles A × singles B × τ / exposure, from every row
          </label>
          {!hasSingles && <p className="mt-1 text-ink-faint">Needs singles on every row; this run has none.</p>}
          <Field label="Window τ (full width)" unit="ns" className="mt-2" error={e.corrections?.windowNs?.message} hint={sessionWindowNs !== null ? `Empty: the session's ${sessionWindowNs} ns.` : "The session has no window; give one here."}>
            {(p) => <input {...register("corrections.windowNs", { setValueAs: optionalNumber })} {...fieldProps(p)} inputMode="decimal" className={`${inputClass} max-w-32 text-right`} />}
          </Field>
        </fieldset>
        <div className="space-y-3">
          <Field label="Relative detector-pair efficiencies" error={e.corrections?.efficiencies?.message ?? (e.corrections?.efficiencies as unknown as Record<number, { message?: string }> | undefined)?.[0]?.message} hint={`One number per row (${run.rows.length}), in row order, separated by commas or spaces. Empty: all 1.`}>
            {(p) => <textarea {...register("corrections.efficiencies", { setValueAs: numberList })} {...fieldProps(p)} rows={2} className={inputClass} />}
          </Field>
          <Field label="Drift normalisation" error={e.corrections?.drift?.message}>
            {(p) => (
              <select {...register("corrections.drift")} {...fieldProps(p)} className={inputClass}>
                <option value="none">None</option>
                <option value="singles" disabled={!hasSingles}>By the summed singles</option>
                <option value="monitor" disabled={!hasMonitor}>By the monitor column</option>
              </select>
            )}
          </Field>
        </div>
      </div>
      {create.isError && !(create.error instanceof ApiError && Object.keys(create.error.fieldMessages()).length) && (
        <Alert kind="error" title="Not reconstructed">
          {create.error.message} The stored results are unchanged.
        </Alert>
      )}
      <Button type="submit" disabled={create.isPending || !run.can.write}>
        {create.isPending ? "Reconstructing…" : "Reconstruct with these settings"}
      </Button>
      {!run.can.write && <p className="text-ink-faint">Your role in this lab can read runs but not add reconstructions.</p>}
    </form>
  );
}
