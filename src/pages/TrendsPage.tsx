import { useParams, useSearchParams } from "react-router-dom";
import { TREND_FIGURE_KEYS, TREND_X_KEYS, type TrendFigureKey, type TrendXKey } from "@shared/schemas/trends";
import { useLabSessions } from "../api/labSessions";
import { useSources } from "../api/sources";
import { Field, inputClass } from "../components/Field";
import { PageTitle } from "../components/PageTitle";
import { Panel } from "../components/Panel";
import { QueryState } from "../components/QueryState";
import { SegmentedToggle } from "../components/SegmentedToggle";
import { RequireSignIn } from "../features/account/RequireSignIn";
import { FIGURE_LABEL, FIGURE_ORDER, X_LABEL, X_ORDER } from "../features/trends/trendAxes";
import { TrendView } from "../features/trends/TrendView";
import { useTrend } from "../features/trends/useTrend";

export function TrendsPage() {
  const { labId = "" } = useParams();
  return (
    <RequireSignIn>
      <Trends labId={labId} />
    </RequireSignIn>
  );
}

const pick = <T extends string>(value: string | null, allowed: readonly T[], fallback: T): T => (allowed.includes(value as T) ? (value as T) : fallback);

/** Every choice lives in the address, so a link reproduces the same plot. */
function Trends({ labId }: { labId: string }) {
  const [search, setSearch] = useSearchParams();
  const sessionId = search.get("sessionId") ?? undefined;
  const sourceId = sessionId ? undefined : (search.get("sourceId") ?? undefined);
  const figure = pick<TrendFigureKey>(search.get("figure"), TREND_FIGURE_KEYS, "fidelityTarget");
  const x = pick<TrendXKey>(search.get("x"), TREND_X_KEYS, "pumpPowerMw");
  const method = pick(search.get("method"), ["mle", "linear", "projected"] as const, "mle");
  const accidentals = search.get("accidentals") === "true";
  const trend = useTrend(labId, { sessionId, sourceId, method, accidentals });
  const sessions = useLabSessions(labId, { pageSize: 100, sort: "date", order: "desc" });
  const sources = useSources(labId, { pageSize: 100 });
  const set = (changes: Record<string, string | undefined>) => {
    const next = new URLSearchParams(search);
    for (const [k, v] of Object.entries(changes)) {
      if (v === undefined || v === "") next.delete(k);
      else next.set(k, v);
    }
    setSearch(next, { replace: true });
  };
  const scopeValue = sessionId ? `session:${sessionId}` : sourceId ? `source:${sourceId}` : "lab";
  return (
    <>
      <PageTitle subtitle="Any figure of merit across runs, against a setup parameter or time — with the pair rate and accidentals beside it.">Trends</PageTitle>
      <Panel title="What to plot" className="mb-4">
        <div className="grid gap-3 md:grid-cols-3">
          <Field label="Runs of">
            {({ id }) => (
              <select id={id} className={inputClass} value={scopeValue} onChange={(e) => {
                const [kind, value] = e.target.value.split(":");
                set({ sessionId: kind === "session" ? value : undefined, sourceId: kind === "source" ? value : undefined });
              }}>
                <option value="lab">The whole lab</option>
                <optgroup label="Sources">
                  {sources.data?.data.map((s) => <option key={s.id} value={`source:${s.id}`}>{s.name} (all sessions)</option>)}
                </optgroup>
                <optgroup label="Sessions">
                  {sessions.data?.data.map((s) => <option key={s.id} value={`session:${s.id}`}>{s.date} — {s.title}</option>)}
                </optgroup>
              </select>
            )}
          </Field>
          <Field label="Figure (y)">
            {({ id }) => (
              <select id={id} className={inputClass} value={figure} onChange={(e) => set({ figure: e.target.value })}>
                {FIGURE_ORDER.map((k) => <option key={k} value={k}>{FIGURE_LABEL[k]}</option>)}
              </select>
            )}
          </Field>
          <Field label="Against (x)">
            {({ id }) => (
              <select id={id} className={inputClass} value={x} onChange={(e) => set({ x: e.target.value })}>
                {X_ORDER.map((k) => <option key={k} value={k}>{X_LABEL[k]}</option>)}
              </select>
            )}
          </Field>
        </div>
        <div className="mt-3 flex flex-wrap gap-4">
          <SegmentedToggle label="Reconstruction" value={method} onChange={(v) => set({ method: v === "mle" ? undefined : v })} options={[{ value: "mle", label: "Maximum likelihood" }, { value: "linear", label: "Linear inversion" }, { value: "projected", label: "Projected" }]} />
          <SegmentedToggle label="Accidentals" value={accidentals ? "true" : "false"} onChange={(v) => set({ accidentals: v === "true" ? "true" : undefined })} options={[{ value: "false", label: "Not subtracted" }, { value: "true", label: "Subtracted" }]} />
        </div>
      </Panel>
      <QueryState query={trend} what="the trend">
        {(t) => <TrendView trend={t} figure={figure} x={x} />}
      </QueryState>
    </>
  );
}
