import { useEffect } from "react";

/** The page's h1, and the browser tab's title. */
export function PageTitle({ children, subtitle, actions }: { children: string; subtitle?: React.ReactNode; actions?: React.ReactNode }) {
  useEffect(() => {
    document.title = `${children} · Rhomb`;
  }, [children]);
  return (
    <div className="mb-6 flex flex-wrap items-end justify-between gap-3">
      <div>
        <h1 className="text-2xl font-bold text-ink">{children}</h1>
        {subtitle && <p className="mt-1 text-ink-soft">{subtitle}</p>}
      </div>
      {actions && <div className="flex items-center gap-2">{actions}</div>}
    </div>
  );
}
