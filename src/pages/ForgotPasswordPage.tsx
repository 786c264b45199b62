import { Link, useSearchParams } from "react-router-dom";
import { AuthCard, linkClass } from "../features/account/AuthCard";
import { ForgotPasswordForm } from "../features/account/ForgotPasswordForm";

export function ForgotPasswordPage() {
  const [params] = useSearchParams();
  return (
    <AuthCard
      title="Forgot your password?"
      subtitle="We e-mail you a link to choose a new one."
      footer={
        <p>
          Remembered it? <Link className={linkClass} to="/sign-in">Sign in</Link>
        </p>
      }
    >
      <ForgotPasswordForm defaultEmail={params.get("email") ?? ""} />
    </AuthCard>
  );
}
