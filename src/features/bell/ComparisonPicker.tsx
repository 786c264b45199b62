import { useRuns } from "../../api/runs";
import { Field, inputClass } from "../../components/Field";

/**
 * Which reconstructed ρ the Bell test is compared with: by default the session's newest
 * maximum-likelihood one; here any tomography run of the session (its headline reconstruction).
 */
export function ComparisonPicker({ labId, sessionId, value, onChange }: { labId: string; sessionId: string; value: string | undefined; onChange: (reconstructionId: string | undefined) => void }) {
  const runs = useRuns(labId, { sessionId, kind: "tomography", pageSize: 100, sort: "createdAt", order: "desc" });
  const options = (runs.data?.data ?? []).filter((r) => r.headline);
  if (options.length === 0) return null;
  return (
    <Field label="Compare with the state of" className="max-w-md">
      {({ id }) => (
        <select id={id} className={inputClass} value={value ?? ""} onChange={(e) => onChange(e.target.value || undefined)}>
          <option value="">The session's newest maximum-likelihood reconstruction</option>
          {options.map((r) => (
            <option key={r.id} value={r.headline!.reconstructionId}>
              {r.name} ({r.headline!.accidentalsSubtracted ? "accidentals subtracted" : "raw counts"})
            </option>
          ))}
        </select>
      )}
    </Field>
  );
}
