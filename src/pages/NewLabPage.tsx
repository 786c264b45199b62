import { PageTitle } from "../components/PageTitle";
import { Panel } from "../components/Panel";
import { RequireSignIn } from "../features/account/RequireSignIn";
import { CreateLabForm } from "../features/labs/CreateLabForm";

export function NewLabPage() {
  return (
    <RequireSignIn>
      <div className="mx-auto max-w-xl">
        <PageTitle subtitle="A lab holds your sources, sessions, runs and reconstructions, and the people who share them.">Create a lab</PageTitle>
        <Panel>
          <CreateLabForm />
        </Panel>
      </div>
    </RequireSignIn>
  );
}
