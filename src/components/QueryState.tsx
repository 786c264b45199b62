import type { UseQueryResult } from "@tanstack/react-query";
import { Alert } from "./Alert";

/**
 * Loading and error states of a query, the same on every page; renders `children(data)` once the
 * data is there.
 */
export function QueryState<T>({ query, what, children }: { query: UseQueryResult<T>; what: string; children: (data: T) => React.ReactNode }) {
  if (query.isPending) {
    return (
      <p className="py-6 text-ink-faint" role="status">
        Loading {what}…
      </p>
    );
  }
  if (query.isError) {
    return (
      <Alert kind="error" title={`Could not load ${what}`}>
        {query.error.message}{" "}
        <button type="button" className="font-bold text-petrol-700 underline" onClick={() => query.refetch()}>
          Try again
        </button>
      </Alert>
    );
  }
  return <>{children(query.data)}</>;
}

/** What an empty list says: what is missing and what to do next. */
export function EmptyState({ title, children, action }: { title: string; children?: React.ReactNode; action?: React.ReactNode }) {
  return (
    <div className="rounded-md border border-dashed border-ink-faint bg-paper px-5 py-6 text-center">
      <p className="font-bold text-ink">{title}</p>
      {children && <div className="mx-auto mt-1 max-w-prose text-sm text-ink-soft">{children}</div>}
      {action && <div className="mt-3 flex justify-center">{action}</div>}
    </div>
  );
}
