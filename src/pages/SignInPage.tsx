import { Link, Navigate, useSearchParams } from "react-router-dom";
import { useMe } from "../api/auth";
import { AuthCard, linkClass } from "../features/account/AuthCard";
import { SignInForm } from "../features/account/SignInForm";
import { safeNext } from "../features/account/safeNext";

export function SignInPage() {
  const [params] = useSearchParams();
  const next = safeNext(params.get("next"));
  const me = useMe();
  if (me.data) return <Navigate to={next} replace />;
  return (
    <AuthCard
      title="Sign in"
      subtitle="Your labs, sources and runs are waiting."
      footer={
        <p>
          New to Rhomb? <Link className={linkClass} to="/sign-up">Create an account</Link>
        </p>
      }
    >
      <SignInForm next={next} defaultEmail={params.get("email") ?? ""} />
    </AuthCard>
  );
}
