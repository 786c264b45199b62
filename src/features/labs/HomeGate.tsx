import { Navigate } from "react-router-dom";
import { useMe } from "../../api/auth";
import { useLabs } from "../../api/labs";
import { useGuestShares } from "../../api/shares";
import { ButtonLink } from "../../components/Button";
import { QueryState } from "../../components/QueryState";
import { Panel } from "../../components/Panel";
import { PageTitle } from "../../components/PageTitle";
import { CreateLabForm } from "./CreateLabForm";
import { lastLabId } from "./lastLab";

/**
 * "/": signed-out visitors see `signedOut` (the introduction); signed-in people go to the lab
 * they used last (or their first); someone without a lab is asked to create one.
 */
export function HomeGate({ signedOut }: { signedOut: React.ReactNode }) {
  const me = useMe();
  const labs = useLabs(!!me.data);
  const guestShares = useGuestShares(!!me.data);
  if (me.isPending) return <p className="text-ink-faint" role="status">Loading…</p>;
  if (!me.data) {
    return (
      <>
        {signedOut}
        <div className="mt-6 flex flex-wrap items-center gap-3 rounded-lg border border-petrol-100 bg-petrol-50 px-5 py-4">
          <p className="mr-auto text-ink">Your lab's notebook is one sign-in away.</p>
          <ButtonLink to="/sign-in">Sign in</ButtonLink>
          <ButtonLink to="/sign-up" variant="secondary">
            Create an account
          </ButtonLink>
        </div>
      </>
    );
  }
  const email = me.data.email;
  return (
    <QueryState query={labs} what="your labs">
      {(list) => {
        const last = lastLabId();
        const target = list.find((l) => l.id === last) ?? list[0];
        if (target) return <Navigate to={`/labs/${target.id}`} replace />;
        // A collaborator outside any lab comes for what was shared with them.
        if (guestShares.isPending) return <p className="text-ink-faint" role="status">Loading…</p>;
        if (guestShares.data?.length) return <Navigate to="/shared-with-me" replace />;
        return (
          <div className="mx-auto max-w-xl">
            <PageTitle subtitle="A lab holds your sources, sessions, runs and reconstructions, and the people who share them.">Create your first lab</PageTitle>
            <Panel>
              <CreateLabForm />
            </Panel>
            <p className="mt-4 text-sm text-ink-soft">Joining a colleague's lab instead? Ask its owner to invite {email}; the invitation arrives by e-mail.</p>
          </div>
        );
      }}
    </QueryState>
  );
}
