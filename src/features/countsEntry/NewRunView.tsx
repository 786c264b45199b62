import { useState } from "react";
import { Link } from "react-router-dom";
import { useLabSession } from "../../api/labSessions";
import { useSource } from "../../api/sources";
import { PageTitle } from "../../components/PageTitle";
import { Panel } from "../../components/Panel";
import { QueryState } from "../../components/QueryState";
import { SegmentedToggle } from "../../components/SegmentedToggle";
import { labPaths } from "../notebook/labPaths";
import { RunFileUpload } from "../runs/RunFileUpload";
import { NewRunForm } from "./NewRunForm";

/** A new run in a session: typed into the grid, or one uploaded file. */
export function NewRunView({ labId, sessionId }: { labId: string; sessionId: string }) {
  const session = useLabSession(labId, sessionId);
  const source = useSource(labId, session.data?.source.id);
  const [how, setHow] = useState<"type" | "upload">("type");
  return (
    <QueryState query={session} what="the session">
      {(s) => (
        <>
          <PageTitle subtitle={<>In <Link className="font-bold text-petrol-700 underline" to={labPaths.session(labId, s.id)}>{s.title}</Link> ({s.date}), source {s.source.name}</>}>New run</PageTitle>
          {!s.can.write ? (
            <p className="text-ink-soft">Your role in this lab can read runs but not add them. Ask an owner for member rights.</p>
          ) : (
            <>
              <div className="mb-4">
                <SegmentedToggle label="How" hideLabel value={how} onChange={setHow} options={[{ value: "type", label: "Type counts" }, { value: "upload", label: "Upload a file" }]} />
              </div>
              {how === "type" ? (
                <NewRunForm labId={labId} session={s} target={source.data?.targetState ?? "psi-"} />
              ) : (
                <Panel title="Upload one counts file">
                  <RunFileUpload labId={labId} sessionId={s.id} />
                </Panel>
              )}
            </>
          )}
        </>
      )}
    </QueryState>
  );
}
