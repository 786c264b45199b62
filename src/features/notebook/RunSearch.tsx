import { useDeferredValue, useState } from "react";
import type { RunKind } from "@shared/schemas/runs";
import { useRuns } from "../../api/runs";
import { ButtonLink } from "../../components/Button";
import type { SortState } from "../../components/DataTable";
import { inputClass } from "../../components/Field";
import { EmptyState, QueryState } from "../../components/QueryState";
import { RunsTable } from "../runs/RunsTable";
import { labPaths } from "./labPaths";
import { Pager } from "./Pager";
import { useSelection } from "./useSelection";

/** Search every run of the lab by text, kind and source; tick runs to compare them. */
export function RunSearch({ labId, sources, initialSelection = [] }: { labId: string; sources: { id: string; name: string }[]; initialSelection?: string[] }) {
  const [q, setQ] = useState("");
  const [kind, setKind] = useState<RunKind | "">("");
  const [sourceId, setSourceId] = useState("");
  const [sort, setSort] = useState<SortState>({ key: "createdAt", order: "desc" });
  const [page, setPage] = useState(1);
  const query = { q: useDeferredValue(q.trim()) || undefined, kind: kind || undefined, sourceId: sourceId || undefined, sort: sort.key as never, order: sort.order, page, pageSize: 10 };
  const runs = useRuns(labId, query);
  const selection = useSelection(initialSelection);
  return (
    <div>
      <div className="flex flex-wrap items-end gap-3" role="search">
        <label className="block min-w-56 flex-1 text-sm font-bold">
          Name or notes contain
          <input type="search" value={q} onChange={(e) => (setQ(e.target.value), setPage(1))} className={`${inputClass} mt-1`} />
        </label>
        <label className="block text-sm font-bold">
          Kind
          <select value={kind} onChange={(e) => (setKind(e.target.value as RunKind | ""), setPage(1))} className={`${inputClass} mt-1`}>
            <option value="">Any</option>
            <option value="tomography">Tomography</option>
            <option value="bell">Bell test</option>
            <option value="fringe">Fringe scan</option>
          </select>
        </label>
        <label className="block text-sm font-bold">
          Source
          <select value={sourceId} onChange={(e) => (setSourceId(e.target.value), setPage(1))} className={`${inputClass} mt-1`}>
            <option value="">Any</option>
            {sources.map((s) => (
              <option key={s.id} value={s.id}>
                {s.name}
              </option>
            ))}
          </select>
        </label>
        <ButtonLink variant="secondary" to={labPaths.compare(labId, [...selection.ids])} aria-disabled={selection.ids.size < 2} className={selection.ids.size < 2 ? "pointer-events-none opacity-50" : ""}>
          Compare {selection.ids.size || ""} ticked
        </ButtonLink>
      </div>
      <div className="mt-3">
        <QueryState query={runs} what="runs">
          {(p) => (
            <>
              <RunsTable
                labId={labId}
                runs={p.data}
                caption="Runs found"
                showSession
                sort={sort}
                onSort={(s) => (setSort(s), setPage(1))}
                selected={selection.ids}
                onToggle={selection.toggle}
                empty={<EmptyState title="No run matches">Try fewer words, or another kind or source.</EmptyState>}
              />
              <Pager page={p.page} onPage={setPage} />
            </>
          )}
        </QueryState>
      </div>
    </div>
  );
}
