import { Navigate, useLocation } from "react-router-dom";
import { useMe } from "../../api/auth";
import { Alert } from "../../components/Alert";

/**
 * Wraps pages that need a signed-in user: while the session is checked it shows a quiet
 * placeholder; a signed-out visitor goes to /sign-in?next=<this page> and comes back after.
 */
export function RequireSignIn({ children }: { children: React.ReactNode }) {
  const me = useMe();
  const location = useLocation();
  if (me.isPending) return <p className="text-ink-faint" aria-live="polite">Checking your sign-in…</p>;
  if (me.isError) return <Alert kind="error" title="Could not check your sign-in">{me.error.message}</Alert>;
  if (!me.data) {
    const next = location.pathname + location.search + location.hash;
    return <Navigate to={`/sign-in?next=${encodeURIComponent(next)}`} replace />;
  }
  return <>{children}</>;
}
