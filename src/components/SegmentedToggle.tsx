import { useId } from "react";

export interface ToggleOption<T extends string> {
  value: T;
  label: string;
  disabled?: boolean;
}

/**
 * A row of mutually exclusive choices (view switch, method switch): native radio inputs, so
 * arrow keys, labels and screen readers work without extra code.
 */
export function SegmentedToggle<T extends string>({ label, options, value, onChange, hideLabel = false }: { label: string; options: ToggleOption<T>[]; value: T; onChange: (v: T) => void; hideLabel?: boolean }) {
  const name = useId();
  return (
    <fieldset className="flex flex-wrap items-center gap-2">
      <legend className={hideLabel ? "sr-only" : "float-left mr-2 text-sm font-bold text-ink-soft"}>{label}</legend>
      <div className="inline-flex rounded-md border border-petrol-700 bg-paper-raised p-0.5">
        {options.map((o) => (
          <label
            key={o.value}
            className={[
              "cursor-pointer rounded px-3 py-1 text-sm font-bold has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-offset-2 has-[:focus-visible]:outline-petrol-500 has-[:focus-visible]:underline has-[:focus-visible]:decoration-2 has-[:focus-visible]:underline-offset-4",
              o.value === value ? "bg-petrol-700 text-paper-raised" : "text-ink-soft hover:bg-paper-sunk",
              o.disabled ? "cursor-not-allowed opacity-50" : "",
            ].join(" ")}
          >
            <input type="radio" className="sr-only" name={name} value={o.value} checked={o.value === value} disabled={o.disabled} onChange={() => onChange(o.value)} />
            {o.label}
          </label>
        ))}
      </div>
    </fieldset>
  );
}
