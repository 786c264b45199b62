import type { ReactNode } from "react";
import { Link } from "react-router-dom";

/**
 * "← Where you came from": the one way a page links back to its parent. On its own line above
 * the page title by default; `inline` inside a toolbar.
 */
export function BackLink({ to, children, inline = false }: { to: string; children: ReactNode; inline?: boolean }) {
  const link = (
    <Link className={`font-bold text-petrol-700 underline${inline ? " text-sm" : ""}`} to={to}>
      ← {children}
    </Link>
  );
  return inline ? link : <p className="mb-1 text-sm">{link}</p>;
}
