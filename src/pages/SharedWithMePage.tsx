import { RequireSignIn } from "../features/account/RequireSignIn";
import { PageTitle } from "../components/PageTitle";
import { GuestShareList } from "../features/sharing/GuestShareList";

/** /shared-with-me — what labs have shared with the signed-in person's address. */
export function SharedWithMePage() {
  return (
    <RequireSignIn>
      <PageTitle subtitle="Sessions, runs and reconstructed states that labs shared with your e-mail address, read-only.">Shared with me</PageTitle>
      <GuestShareList />
    </RequireSignIn>
  );
}
