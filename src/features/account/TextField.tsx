import type { UseFormRegisterReturn } from "react-hook-form";
import { Field, inputClass } from "../../components/Field";

/** A labelled text input bound to react-hook-form, with its hint and error read out together. */
export function TextField({ label, hint, error, registration, type = "text", autoComplete, autoFocus }: {
  label: string;
  hint?: React.ReactNode;
  error?: string;
  registration: UseFormRegisterReturn;
  type?: "text" | "email" | "password";
  autoComplete?: string;
  autoFocus?: boolean;
}) {
  return (
    <Field label={label} hint={hint} error={error}>
      {({ id, describedBy, invalid }) => (
        <input id={id} type={type} autoComplete={autoComplete} autoFocus={autoFocus} aria-describedby={describedBy} aria-invalid={invalid} className={inputClass} {...registration} />
      )}
    </Field>
  );
}
