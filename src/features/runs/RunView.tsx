import { useState } from "react";
import { Link } from "react-router-dom";
import { useLabSession } from "../../api/labSessions";
import { useRun } from "../../api/runs";
import { Button, ButtonLink } from "../../components/Button";
import { PageTitle } from "../../components/PageTitle";
import { Panel } from "../../components/Panel";
import { QueryState } from "../../components/QueryState";
import { formatCount, formatDecimal } from "@shared/format/uncertainty";
import { labPaths } from "../notebook/labPaths";
import { CorrectCountsForm } from "./CorrectCountsForm";
import { RawCounts } from "./RawCounts";
import { RunStateView } from "./RunStateView";
import { ShareExportActions } from "../sharing/ShareExportActions";

/** A run: its reconstructed state and its raw counts. */
export function RunView({ labId, runId }: { labId: string; runId: string }) {
  const run = useRun(labId, runId);
  const session = useLabSession(labId, run.data?.session.id ?? "");
  const [correcting, setCorrecting] = useState(false);
  return (
    <QueryState query={run} what="the run">
      {(r) => (
        <>
          <PageTitle
            subtitle={
              <>
                <Link className="font-bold text-petrol-700 underline" to={labPaths.session(labId, r.session.id)}>
                  {r.session.title}
                </Link>{" "}
                ({r.session.date}) · {r.source.name} · {r.rowCount} settings, {formatCount(r.totalCounts)} coincidences
                {r.conditions.pumpPowerMw !== null && ` · pump ${formatDecimal(r.conditions.pumpPowerMw, 3)} mW`}
              </>
            }
            actions={
              <>
                <ButtonLink variant="secondary" to={`${labPaths.compare(labId, [r.id])}`}>
                  Compare with other runs
                </ButtonLink>
                <ShareExportActions labId={labId} itemType="run" itemId={r.id} can={r.can} />
              </>
            }
          >
            {r.name}
          </PageTitle>
          {r.notes && <p className="-mt-3 mb-4 whitespace-pre-wrap text-sm text-ink-soft">{r.notes}</p>}
          {r.kind === "tomography" ? (
            <RunStateView labId={labId} run={r} sessionWindowNs={session.data?.coincidenceWindowNs ?? null} />
          ) : (
            <p className="text-ink-soft">
              This is a {r.kind === "bell" ? "Bell test" : "fringe scan"}; its analysis has{" "}
              <Link className="font-bold text-petrol-700 underline" to={`${labPaths.run(labId, r.id)}/${r.kind === "bell" ? "bell-test" : "fringe-fit"}`}>
                its own page
              </Link>
              .
            </p>
          )}
          <div className="mt-4">
            <Panel
              title="Raw counts"
              actions={
                r.can.write &&
                !correcting && (
                  <Button variant="quiet" size="sm" onClick={() => setCorrecting(true)}>
                    Correct counts…
                  </Button>
                )
              }
            >
              {correcting ? <CorrectCountsForm labId={labId} run={r} onDone={() => setCorrecting(false)} /> : <RawCounts run={r} />}
            </Panel>
          </div>
        </>
      )}
    </QueryState>
  );
}
