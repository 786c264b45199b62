import { useMe } from "../api/auth";
import { PageTitle } from "../components/PageTitle";
import { AccountSettings } from "../features/account/AccountSettings";
import { RequireSignIn } from "../features/account/RequireSignIn";

export function AccountPage() {
  const me = useMe();
  return (
    <RequireSignIn>
      <PageTitle subtitle={me.data?.email}>Account settings</PageTitle>
      {me.data && <AccountSettings me={me.data} />}
    </RequireSignIn>
  );
}
