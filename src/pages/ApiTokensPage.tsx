import { RequireSignIn } from "../features/account/RequireSignIn";
import { ApiTokensView } from "../features/apiTokens/ApiTokensView";

export function ApiTokensPage() {
  return (
    <RequireSignIn>
      <ApiTokensView />
    </RequireSignIn>
  );
}
