import { useParams } from "react-router-dom";
import { useLab } from "../api/labs";
import { BackLink } from "../components/BackLink";
import { PageTitle } from "../components/PageTitle";
import { Panel } from "../components/Panel";
import { QueryState } from "../components/QueryState";
import { RequireSignIn } from "../features/account/RequireSignIn";
import { InvitationsList } from "../features/labs/InvitationsList";
import { InviteForm } from "../features/labs/InviteForm";
import { LabSettings } from "../features/labs/LabSettings";
import { MembersTable } from "../features/labs/MembersTable";

export function MembersPage() {
  const { labId = "" } = useParams();
  return (
    <RequireSignIn>
      <LabPeople labId={labId} />
    </RequireSignIn>
  );
}

function LabPeople({ labId }: { labId: string }) {
  const lab = useLab(labId);
  return (
    <QueryState query={lab} what="the lab">
      {(l) => (
        <>
          <BackLink to={`/labs/${l.id}`}>{l.name}</BackLink>
          <PageTitle subtitle={l.can.manage ? "Invite people, choose their roles, or remove them." : "Who works in this lab, and in which role."}>People</PageTitle>
          <div className="space-y-4">
            <Panel title="Members">
              <MembersTable labId={l.id} />
            </Panel>
            {l.can.manage && (
              <>
                <Panel title="Invite someone">
                  <InviteForm labId={l.id} />
                </Panel>
                <Panel title="Open invitations">
                  <InvitationsList labId={l.id} />
                </Panel>
                <Panel title="Lab settings">
                  <LabSettings lab={l} />
                </Panel>
              </>
            )}
          </div>
        </>
      )}
    </QueryState>
  );
}
