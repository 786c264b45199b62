import { Link, useLocation } from "react-router-dom";
import { PageTitle } from "../components/PageTitle";

export function NotFoundPage() {
  const { pathname } = useLocation();
  return (
    <div className="mx-auto max-w-xl py-12 text-center">
      <PageTitle>Page not found</PageTitle>
      <p className="text-ink-soft">
        There is no page at <code className="rounded bg-paper-sunk px-1.5 py-0.5">{pathname}</code>. It may have moved, or the link may be mistyped.
      </p>
      <Link to="/" className="mt-6 inline-block rounded-md bg-petrol-700 px-4 py-2 font-bold text-paper-raised hover:bg-petrol-800">
        Back to the notebook
      </Link>
    </div>
  );
}
