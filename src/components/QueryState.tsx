import type { UseQueryResult } from "@tanstack/react-query";
import { Link } from "react-router-dom";
import { ApiError } from "../api/client";
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
    // Not found or not allowed will not change by asking again: say so, and offer a way on.
    // The API answers 404 for items of labs one is not in, so both mean "not for you, or gone".
    const status = query.error instanceof ApiError ? query.error.status : null;
    if (status === 404 || status === 403) {
      return (
        <Alert kind="error" title={`No access to ${what}`}>
          {query.error.message} It may have been deleted, or it belongs to a lab you are not a member of. Items shared with you are under{" "}
          <Link className="font-bold text-petrol-700 underline" to="/shared-with-me">
            Shared with me
          </Link>
          ; your labs are on the{" "}
          <Link className="font-bold text-petrol-700 underline" to="/">
            home page
          </Link>
          .
        </Alert>
      );
    }
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
