import { useState } from "react";
import { Button } from "../../components/Button";
import { Field, inputClass } from "../../components/Field";
import { SegmentedToggle } from "../../components/SegmentedToggle";
import type { BackgroundChoice } from "./useFringeFit";

/**
 * How the fit treats the background. A fringe alone cannot tell the background from its mean,
 * so the background is given, never fitted: none, each row's accidentals from its singles, or
 * a measured rate (e.g. with the pump blocked).
 */
export function BackgroundControls({ value, onChange, sessionWindowNs }: { value: BackgroundChoice; onChange: (v: BackgroundChoice) => void; sessionWindowNs: number | null }) {
  const [rate, setRate] = useState(value.background === "rate" ? String(value.backgroundRate) : "");
  const [sigma, setSigma] = useState(value.background === "rate" ? String(value.backgroundSigma) : "0");
  const [error, setError] = useState<string | null>(null);
  const applyRate = (e: React.FormEvent) => {
    e.preventDefault();
    const r = Number(rate);
    const s = Number(sigma || "0");
    if (rate.trim() === "" || !Number.isFinite(r) || r < 0) return setError("Enter the background rate in counts per second (0 or more).");
    if (!Number.isFinite(s) || s < 0) return setError("The uncertainty is 0 or more counts per second.");
    setError(null);
    onChange({ background: "rate", backgroundRate: r, backgroundSigma: s });
  };
  return (
    <div className="space-y-3">
      <SegmentedToggle
        label="Background"
        hideLabel
        value={value.background}
        onChange={(v) => (v === "rate" ? onChange({ background: "rate", backgroundRate: Number(rate) || 0, backgroundSigma: Number(sigma) || 0 }) : onChange(v === "accidentals" ? { background: "accidentals" } : { background: "none" }))}
        options={[
          { value: "none", label: "None (raw fringe)" },
          { value: "accidentals", label: "Accidentals from singles" },
          { value: "rate", label: "Measured rate" },
        ]}
      />
      {value.background === "accidentals" && (
        <p className="text-sm text-ink-soft">
          Each row's accidentals s<sub>A</sub>·s<sub>B</sub>·τ/t, with τ = {sessionWindowNs ? `${sessionWindowNs} ns (the session's window)` : "— the session records no coincidence window"}.
        </p>
      )}
      {value.background === "rate" && (
        <form onSubmit={applyRate} className="flex flex-wrap items-end gap-3" noValidate>
          <Field label="Background rate" unit="counts/s" error={error ?? undefined} className="w-48">
            {({ id, describedBy, invalid }) => <input id={id} inputMode="decimal" className={`${inputClass} text-right tabular-nums`} aria-describedby={describedBy} aria-invalid={invalid} value={rate} onChange={(e) => setRate(e.target.value)} />}
          </Field>
          <Field label="Its uncertainty" unit="counts/s" className="w-48">
            {({ id }) => <input id={id} inputMode="decimal" className={`${inputClass} text-right tabular-nums`} value={sigma} onChange={(e) => setSigma(e.target.value)} />}
          </Field>
          <Button type="submit">Refit</Button>
        </form>
      )}
    </div>
  );
}
