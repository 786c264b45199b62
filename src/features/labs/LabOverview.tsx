import { Link } from "react-router-dom";
import { useLab } from "../../api/labs";
import { Panel } from "../../components/Panel";
import { PageTitle } from "../../components/PageTitle";
import { QueryState } from "../../components/QueryState";
import { roleWords } from "./roleWords";

/** A plain lab page (name, your role, where to go); the notebook's lab home takes its place. */
export function LabOverview({ labId }: { labId: string }) {
  const lab = useLab(labId);
  return (
    <QueryState query={lab} what="the lab">
      {(l) => (
        <>
          <PageTitle subtitle={l.institution || undefined}>{l.name}</PageTitle>
          <Panel title="Your role">
            <p className="text-ink-soft">
              You are {roleWords[l.role].article} <strong className="text-ink">{l.role}</strong> here: {roleWords[l.role].can}.
            </p>
            <Link to={`/labs/${l.id}/members`} className="mt-3 inline-block font-bold text-petrol-700 underline">
              {l.can.manage ? "Manage people and invitations" : "See who is in this lab"}
            </Link>
          </Panel>
        </>
      )}
    </QueryState>
  );
}
