import { Alert } from "../../components/Alert";

/** The form-level message (errors.root.server), if any. */
export function FormAlert({ message, title = "That did not work" }: { message?: string; title?: string }) {
  if (!message) return null;
  return (
    <div className="mb-4">
      <Alert kind="error" title={title}>
        {message}
      </Alert>
    </div>
  );
}
