import { useState } from "react";

/** A set of ticked ids (runs to compare). */
export function useSelection(initial: string[] = []) {
  const [ids, setIds] = useState(() => new Set(initial));
  const toggle = (id: string) =>
    setIds((prev) => {
      const next = new Set(prev);
      if (next.has(id)) next.delete(id);
      else next.add(id);
      return next;
    });
  return { ids, toggle };
}
