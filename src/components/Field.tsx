import { useId } from "react";

export interface FieldProps {
  label: string;
  hint?: React.ReactNode;
  error?: string;
  /** Unit shown after the input, e.g. "mW". */
  unit?: string;
  className?: string;
  children: (ids: { id: string; describedBy: string | undefined; invalid: boolean }) => React.ReactNode;
}

/** Label, input (given as a render function), hint and error, wired together for screen readers. */
export function Field({ label, hint, error, unit, className = "", children }: FieldProps) {
  const id = useId();
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const describedBy = [hintId, errorId].filter(Boolean).join(" ") || undefined;
  return (
    <div className={className}>
      <label htmlFor={id} className="block text-sm font-bold text-ink">
        {label}
      </label>
      <div className="mt-1 flex items-center gap-2">
        {children({ id, describedBy, invalid: !!error })}
        {unit && <span className="text-sm text-ink-soft">{unit}</span>}
      </div>
      {hint && (
        <p id={hintId} className="mt-1 text-xs text-ink-faint">
          {hint}
        </p>
      )}
      {error && (
        <p id={errorId} className="mt-1 text-sm font-bold text-danger">
          {error}
        </p>
      )}
    </div>
  );
}

/** The look of every text input, select and textarea. */
export const inputClass =
  "w-full rounded-md border border-ink-faint bg-paper-raised px-2.5 py-1.5 text-ink placeholder:text-ink-faint aria-[invalid=true]:border-danger aria-[invalid=true]:bg-danger-soft";

/** Spread onto the input inside a <Field>: its id, description and invalid state. */
export function fieldProps({ id, describedBy, invalid }: { id: string; describedBy: string | undefined; invalid: boolean }) {
  return { id, "aria-describedby": describedBy, "aria-invalid": invalid };
}
