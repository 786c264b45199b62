import { useEffect, useRef } from "react";
import { Link } from "react-router-dom";
import { useVerifyEmail } from "../../api/auth";
import { Alert } from "../../components/Alert";
import { ButtonLink } from "../../components/Button";
import { linkClass } from "./AuthCard";

/** Opening the e-mailed link confirms the address at once (one request, even in StrictMode). */
export function VerifyEmail({ token }: { token: string }) {
  const verify = useVerifyEmail();
  const sent = useRef(false);
  useEffect(() => {
    if (sent.current || !token) return;
    sent.current = true;
    verify.mutate(token);
  }, [token, verify]);

  if (!token) {
    return (
      <Alert kind="error" title="This link is incomplete">
        Copy the whole link from the e-mail into the address bar.
      </Alert>
    );
  }
  if (verify.isError) {
    return (
      <div className="space-y-4">
        <Alert kind="error" title="Could not confirm the address">
          {verify.error.message}
        </Alert>
        <p className="text-sm text-ink-soft">
          Already confirmed? <Link className={linkClass} to="/sign-in">Sign in</Link>. Need a new link? Sign in with your password and ask for one there.
        </p>
      </div>
    );
  }
  if (verify.isSuccess) {
    return (
      <div className="space-y-4">
        <Alert kind="success" title="Address confirmed">
          Welcome, {verify.data.displayName}. You are signed in as {verify.data.email}.
        </Alert>
        <ButtonLink to="/">Continue to Rhomb</ButtonLink>
      </div>
    );
  }
  return (
    <p role="status" className="text-ink-soft">
      Confirming your e-mail address…
    </p>
  );
}
