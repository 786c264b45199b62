import { useSearchParams } from "react-router-dom";
import { AuthCard } from "../features/account/AuthCard";
import { VerifyEmail } from "../features/account/VerifyEmail";

export function VerifyEmailPage() {
  const [params] = useSearchParams();
  return (
    <AuthCard title="Confirm your e-mail address">
      <VerifyEmail token={params.get("token") ?? ""} />
    </AuthCard>
  );
}
