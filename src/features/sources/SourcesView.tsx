import { useState } from "react";
import { Link } from "react-router-dom";
import { useLab } from "../../api/labs";
import { useCreateSource, useSources } from "../../api/sources";
import { DataTable, type SortState } from "../../components/DataTable";
import { formatDecimal } from "@shared/format/uncertainty";
import { PageTitle } from "../../components/PageTitle";
import { Panel } from "../../components/Panel";
import { EmptyState, QueryState } from "../../components/QueryState";
import { labPaths } from "../notebook/labPaths";
import { Pager } from "../notebook/Pager";
import { BELL_SYMBOL } from "../stateView/meritRows";
import { SourceForm } from "./SourceForm";

/** The lab's pair sources, and a form to add one. */
export function SourcesView({ labId }: { labId: string }) {
  const [sort, setSort] = useState<SortState>({ key: "name", order: "asc" });
  const [page, setPage] = useState(1);
  const sources = useSources(labId, { sort: sort.key as never, order: sort.order, page });
  const create = useCreateSource(labId);
  const canWrite = useLab(labId).data?.can.write ?? false;
  return (
    <>
      <PageTitle subtitle="The photon-pair sources this lab characterises. Each session belongs to one.">Sources</PageTitle>
      <div className="grid gap-4 xl:grid-cols-[3fr_2fr]">
        <Panel title="All sources">
          <QueryState query={sources} what="sources">
            {(p) => (
              <>
                <DataTable
                  caption="Sources"
                  captionHidden
                  rows={p.data}
                  rowKey={(s) => s.id}
                  sort={sort}
                  onSort={setSort}
                  empty={<EmptyState title="No sources yet">Add the source you are characterising with the form beside this list; then open a session for it.</EmptyState>}
                  columns={[
                    { key: "name", header: "Name", sortKey: "name", render: (s) => <span className="font-bold">{s.name}</span> },
                    { key: "target", header: "Target", render: (s) => BELL_SYMBOL[s.targetState] },
                    { key: "crystal", header: "Crystal", render: (s) => s.crystal || "—" },
                    { key: "wl", header: "λ (nm)", numeric: true, render: (s) => formatDecimal(s.wavelengthNm, 3) },
                    { key: "sessions", header: "Sessions", numeric: true, render: (s) => s.sessionCount },
                    {
                      key: "go",
                      header: <span className="sr-only">Actions</span>,
                      render: (s) =>
                        s.can.write && (
                          <Link className="text-sm font-bold text-petrol-700 underline" to={labPaths.newSession(labId, s.id)}>
                            New session
                          </Link>
                        ),
                    },
                  ]}
                />
                <Pager page={p.page} onPage={setPage} />
              </>
            )}
          </QueryState>
        </Panel>
        {canWrite && (
          <Panel title="Add a source">
            <SourceForm submitLabel="Add source" onSubmit={(v) => create.mutateAsync(v)} pending={create.isPending} error={create.error} />
            {create.isSuccess && <p className="mt-2 text-sm text-success" role="status">Added “{create.data.name}”.</p>}
          </Panel>
        )}
      </div>
    </>
  );
}
