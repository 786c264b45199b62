import { PageTitle } from "../components/PageTitle";
import { DevOutbox } from "../features/account/DevOutbox";

export function DevOutboxPage() {
  return (
    <>
      <PageTitle subtitle="Development only: e-mail this server would have sent, caught by its local fake SMTP server. Nothing here left the machine.">Development outbox</PageTitle>
      <DevOutbox />
    </>
  );
}
