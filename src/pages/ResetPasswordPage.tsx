import { useSearchParams } from "react-router-dom";
import { AuthCard } from "../features/account/AuthCard";
import { ResetPasswordForm } from "../features/account/ResetPasswordForm";

export function ResetPasswordPage() {
  const [params] = useSearchParams();
  return (
    <AuthCard title="Choose a new password">
      <ResetPasswordForm token={params.get("token") ?? ""} />
    </AuthCard>
  );
}
