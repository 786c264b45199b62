import { useState } from "react";
import { useLabSession, useUpdateLabSession } from "../../api/labSessions";
import { useRuns } from "../../api/runs";
import { useSources } from "../../api/sources";
import { Button, ButtonLink } from "../../components/Button";
import type { SortState } from "../../components/DataTable";
import { PageTitle } from "../../components/PageTitle";
import { Panel } from "../../components/Panel";
import { EmptyState, QueryState } from "../../components/QueryState";
import { labPaths } from "../notebook/labPaths";
import { Pager } from "../notebook/Pager";
import { useSelection } from "../notebook/useSelection";
import { RunsTable } from "../runs/RunsTable";
import { ShareExportActions } from "../sharing/ShareExportActions";
import { SessionSetupForm, sessionFormDefaults } from "./SessionSetupForm";
import { SetupSummary } from "./SetupSummary";

/** A lab session: its setup (editable) and the sortable table of its runs. */
export function SessionView({ labId, sessionId }: { labId: string; sessionId: string }) {
  const session = useLabSession(labId, sessionId);
  const [editing, setEditing] = useState(false);
  return (
    <QueryState query={session} what="the session">
      {(s) => (
        <>
          <PageTitle
            subtitle={`${s.date} · ${s.source.name}`}
            actions={
              <>
                {s.can.write && <ButtonLink to={labPaths.newRun(labId, s.id)}>New tomography run</ButtonLink>}
                {s.can.write && (
                  <ButtonLink variant="secondary" to={labPaths.batchUpload(labId, s.id)}>
                    Upload many files
                  </ButtonLink>
                )}
                {s.can.write && (
                  <ButtonLink variant="secondary" to={labPaths.newBellTest(labId, s.id)}>
                    New Bell test
                  </ButtonLink>
                )}
                {s.can.write && (
                  <ButtonLink variant="secondary" to={labPaths.newFringeScan(labId, s.id)}>
                    New fringe scan
                  </ButtonLink>
                )}
                <ButtonLink variant="secondary" to={labPaths.trends(labId, { sessionId: s.id })}>
                  Trends
                </ButtonLink>
                <ShareExportActions labId={labId} itemType="session" itemId={s.id} can={s.can} />
              </>
            }
          >
            {s.title}
          </PageTitle>
          <div className="space-y-4">
            <Panel
              title="Setup"
              actions={
                s.can.write && (
                  <Button variant="quiet" size="sm" onClick={() => setEditing((e) => !e)} aria-expanded={editing}>
                    {editing ? "Close without saving" : "Edit setup"}
                  </Button>
                )
              }
            >
              {editing ? <EditSetup labId={labId} session={s} onDone={() => setEditing(false)} /> : <SetupSummary session={s} />}
            </Panel>
            <SessionRuns labId={labId} sessionId={s.id} canWrite={s.can.write} />
          </div>
        </>
      )}
    </QueryState>
  );
}

function EditSetup({ labId, session, onDone }: { labId: string; session: Parameters<typeof SetupSummary>[0]["session"]; onDone: () => void }) {
  const update = useUpdateLabSession(labId, session.id);
  const sources = useSources(labId, { pageSize: 100 });
  return (
    <>
      <p className="mb-3 text-sm text-ink-soft">Changing the setup does not change stored runs or their reconstructions; new reconstructions use the new setup.</p>
      <SessionSetupForm
        sources={sources.data?.data ?? [{ ...session.source } as never]}
        initial={sessionFormDefaults(session)}
        submitLabel="Save setup"
        pending={update.isPending}
        error={update.error}
        onSubmit={async (v) => {
          await update.mutateAsync(v);
          onDone();
        }}
      />
    </>
  );
}

function SessionRuns({ labId, sessionId, canWrite }: { labId: string; sessionId: string; canWrite: boolean }) {
  const [sort, setSort] = useState<SortState>({ key: "createdAt", order: "asc" });
  const [page, setPage] = useState(1);
  const runs = useRuns(labId, { sessionId, sort: sort.key as never, order: sort.order, page });
  const selection = useSelection();
  return (
    <Panel
      title="Runs"
      actions={
        <ButtonLink variant="secondary" size="sm" to={labPaths.compare(labId, [...selection.ids])} aria-disabled={selection.ids.size < 2} className={selection.ids.size < 2 ? "pointer-events-none opacity-50" : ""}>
          Compare {selection.ids.size || ""} ticked
        </ButtonLink>
      }
    >
      <QueryState query={runs} what="runs">
        {(p) => (
          <>
            <RunsTable
              labId={labId}
              runs={p.data}
              caption="Runs of this session"
              sort={sort}
              onSort={setSort}
              selected={selection.ids}
              onToggle={selection.toggle}
              empty={
                <EmptyState title="No runs in this session yet" action={canWrite && <ButtonLink to={labPaths.newRun(labId, sessionId)}>Enter counts for a run</ButtonLink>}>
                  A run is one table of counts: turn the waveplates to each setting and type the counts, or upload a file.
                </EmptyState>
              }
            />
            <Pager page={p.page} onPage={setPage} />
          </>
        )}
      </QueryState>
    </Panel>
  );
}
