import { Link } from "react-router-dom";
import { AuthCard, linkClass } from "../features/account/AuthCard";
import { SignUpForm } from "../features/account/SignUpForm";

export function SignUpPage() {
  return (
    <AuthCard
      title="Create your account"
      subtitle="Then create a lab, or join one you are invited to."
      footer={
        <p>
          Already have an account? <Link className={linkClass} to="/sign-in">Sign in</Link>
        </p>
      }
    >
      <SignUpForm />
    </AuthCard>
  );
}
