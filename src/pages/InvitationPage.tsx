import { useSearchParams } from "react-router-dom";
import { AuthCard } from "../features/account/AuthCard";
import { InvitationAccept } from "../features/labs/InvitationAccept";

export function InvitationPage() {
  const [params] = useSearchParams();
  return (
    <AuthCard title="You are invited">
      <InvitationAccept token={params.get("token") ?? ""} />
    </AuthCard>
  );
}
