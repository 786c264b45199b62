import { useId } from "react";
import { useNavigate } from "react-router-dom";
import { useLabs } from "../../api/labs";
import { useCurrentLabId } from "./useCurrentLabId";

const NEW_LAB = "__new__";

/** Which lab you are in; choosing another opens it (/labs/:labId), or starts a new one. */
export function LabSwitcher() {
  const labs = useLabs();
  const current = useCurrentLabId();
  const navigate = useNavigate();
  const id = useId();
  if (!labs.isSuccess) return null;
  const value = current && labs.data.some((l) => l.id === current) ? current : "";
  return (
    <div className="flex items-center gap-2">
      <label htmlFor={id} className="text-sm font-bold text-ink-soft">
        Lab
      </label>
      <select
        id={id}
        value={value}
        onChange={(e) => navigate(e.target.value === NEW_LAB ? "/labs/new" : `/labs/${e.target.value}`)}
        className="max-w-56 rounded-md border border-ink-faint bg-paper-raised px-2 py-1 text-sm text-ink"
      >
        {!value && <option value="">{labs.data.length ? "Choose a lab…" : "No lab yet"}</option>}
        {labs.data.map((lab) => (
          <option key={lab.id} value={lab.id}>
            {lab.name}
          </option>
        ))}
        <option value={NEW_LAB}>+ New lab…</option>
      </select>
    </div>
  );
}
