import type { FieldValues, Path, UseFormSetError } from "react-hook-form";
import { ApiError } from "../../api/client";

/**
 * Puts the server's field messages (ApiError.fieldMessages()) on the form's fields; whatever
 * names no known field becomes the form-level message in errors.root.server.
 */
export function showServerErrors<T extends FieldValues>(err: unknown, setError: UseFormSetError<T>, fields: ReadonlyArray<Path<T>>): void {
  const byField = err instanceof ApiError ? err.fieldMessages() : {};
  let placed = false;
  for (const f of fields) {
    if (byField[f]) {
      setError(f, { type: "server", message: byField[f] });
      placed = true;
    }
  }
  if (!placed) setError("root.server" as Path<T>, { type: "server", message: err instanceof Error ? err.message : String(err) });
}
