import { useState } from "react";
import { type BellAngles, STANDARD_BELL_ANGLES, armAnglesForPolariser } from "@shared/physics/bell";
import { Button } from "../../components/Button";
import { Field, inputClass } from "../../components/Field";

const FIELDS: { key: keyof BellAngles; label: string }[] = [
  { key: "aDeg", label: "a (arm A)" },
  { key: "aPrimeDeg", label: "a′ (arm A)" },
  { key: "bDeg", label: "b (arm B)" },
  { key: "bPrimeDeg", label: "b′ (arm B)" },
];

/**
 * The four analyser angles of the CHSH sum, editable; beside each, the waveplate angles that
 * set it (QWP θ, HWP θ/2) and the orthogonal setting the other PBS port sees.
 */
export function BellAnglesForm({ angles, onApply, applyLabel = "Recompute at these angles" }: { angles: BellAngles; onApply: (angles: BellAngles | undefined) => void; applyLabel?: string }) {
  const [draft, setDraft] = useState<Record<keyof BellAngles, string>>(() => toDraft(angles));
  const [errors, setErrors] = useState<Partial<Record<keyof BellAngles, string>>>({});
  const apply = (e: React.FormEvent) => {
    e.preventDefault();
    const next: Partial<BellAngles> = {};
    const errs: typeof errors = {};
    for (const { key } of FIELDS) {
      const v = Number(draft[key].replace("−", "-"));
      if (draft[key].trim() === "" || !Number.isFinite(v)) errs[key] = "Enter an angle in degrees.";
      else if (Math.abs(v) > 360) errs[key] = "Between −360° and 360°.";
      else next[key] = v;
    }
    setErrors(errs);
    if (Object.keys(errs).length === 0) onApply(next as BellAngles);
  };
  const reset = () => {
    setDraft(toDraft(STANDARD_BELL_ANGLES));
    setErrors({});
    onApply({ ...STANDARD_BELL_ANGLES });
  };
  return (
    <form onSubmit={apply} noValidate>
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        {FIELDS.map(({ key, label }) => {
          const value = Number(draft[key]);
          const plates = Number.isFinite(value) ? armAnglesForPolariser(value) : null;
          return (
            <Field key={key} label={label} unit="°" error={errors[key]} hint={plates ? `QWP ${fmt(plates.qwpDeg)}°, HWP ${fmt(plates.hwpDeg)}°; other port ${fmt(value + 90)}°` : undefined}>
              {({ id, describedBy, invalid }) => (
                <input
                  id={id}
                  inputMode="decimal"
                  className={`${inputClass} text-right tabular-nums`}
                  aria-describedby={describedBy}
                  aria-invalid={invalid}
                  value={draft[key]}
                  onChange={(e) => setDraft({ ...draft, [key]: e.target.value })}
                />
              )}
            </Field>
          );
        })}
      </div>
      <div className="mt-3 flex flex-wrap gap-2">
        <Button type="submit">{applyLabel}</Button>
        <Button variant="secondary" onClick={reset}>
          Standard angles (0°, 45°, 22.5°, 67.5°)
        </Button>
      </div>
    </form>
  );
}

function toDraft(a: BellAngles): Record<keyof BellAngles, string> {
  return { aDeg: String(a.aDeg), aPrimeDeg: String(a.aPrimeDeg), bDeg: String(a.bDeg), bPrimeDeg: String(a.bPrimeDeg) };
}

function fmt(deg: number): string {
  const r = Math.round(deg * 1000) / 1000;
  return r < 0 ? `−${-r}` : String(r);
}
