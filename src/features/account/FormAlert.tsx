import { Alert } from "../../components/Alert";

/** The form-level message (errors.root.server), if any. */
export function FormAlert({ message, title = "That did not work", kind = "error" }: { message?: string; title?: string; kind?: "error" | "caution" }) {
  if (!message) return null;
  return (
    <div className="mb-4">
      <Alert kind={kind} title={title}>
        {message}
      </Alert>
    </div>
  );
}
