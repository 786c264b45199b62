import type { TrendDto, TrendFigureKey, TrendRunDto, TrendXKey } from "@shared/schemas/trends";
import { Alert } from "../../components/Alert";
import { type Column, DataTable } from "../../components/DataTable";
import { EmptyState } from "../../components/QueryState";
import { ValueWithError } from "../../components/ValueWithError";
import { ChartFrame } from "../../plots/charts/ChartFrame";
import { TrendChart, type TrendPoint, type TrendSeries } from "../../plots/charts/TrendChart";
import { FIGURE_LABEL, X_LABEL, timeTick } from "./trendAxes";

/** Runs that have both the chosen x and the chosen figure, grouped by session. */
function seriesOf(runs: TrendRunDto[], x: TrendXKey, value: (r: TrendRunDto) => { value: number; sigma: number | null } | null): TrendSeries[] {
  const groups = new Map<string, TrendPoint[]>();
  const titles = new Map<string, string>();
  for (const r of runs) {
    const xv = r.x[x];
    const v = value(r);
    if (xv === null || !v) continue;
    titles.set(r.sessionId, r.sessionTitle);
    const list = groups.get(r.sessionId) ?? [];
    list.push({ x: xv, y: v.value, sigma: v.sigma ?? 0, label: r.name });
    groups.set(r.sessionId, list);
  }
  return [...groups].map(([id, points]) => ({ label: titles.get(id)!, points }));
}

function merged(series: TrendSeries[], label: string, styleIndex: number, axis: "left" | "right" = "left"): TrendSeries[] {
  const points = series.flatMap((s) => s.points.map((p) => ({ ...p, label: `${p.label} (${s.label})` })));
  return points.length ? [{ label, points, styleIndex, axis }] : [];
}

/** Setup parameters as entered (no padding zeros): 5, 2.5, 31.2. */
function plainNumber(v: number): string {
  return String(Number(v.toPrecision(6))).replace("-", "−");
}

/** Runs in the order of the plotted parameter (runs without it last), as the eye reads the chart. */
function byX(runs: TrendRunDto[], x: TrendXKey): TrendRunDto[] {
  return [...runs].sort((a, b) => (a.x[x] ?? Infinity) - (b.x[x] ?? Infinity));
}

export function TrendView({ trend, figure, x }: { trend: TrendDto; figure: TrendFigureKey; x: TrendXKey }) {
  const xAxis = { label: X_LABEL[x], tickFormat: x === "recordedAt" ? timeTick : undefined };
  const figureSeries = seriesOf(trend.runs, x, (r) => r.figures[figure]);
  // One series per quantity (not per session): the two rates are told apart by marker and axis.
  const pairSeries = merged(seriesOf(trend.runs, x, (r) => r.pairRate), "Pair rate (left)", 0);
  const accidentalSeries = merged(seriesOf(trend.runs, x, (r) => (r.accidentalRate === null ? null : { value: r.accidentalRate, sigma: null })), "Accidentals (right)", 1, "right");
  const plotted = figureSeries.reduce((n, s) => n + s.points.length, 0);
  const missingX = trend.runs.filter((r) => r.x[x] === null).length;
  const columns: Column<TrendRunDto>[] = [
    { key: "name", header: "Run", render: (r) => <span className="font-bold">{r.name}</span> },
    { key: "session", header: "Session", render: (r) => r.sessionTitle },
    { key: "kind", header: "Kind", render: (r) => r.kind },
    { key: "x", header: X_LABEL[x], numeric: true, render: (r) => (r.x[x] === null ? "—" : x === "recordedAt" ? timeTick(r.x[x]!) : plainNumber(r.x[x]!)) },
    { key: "fig", header: FIGURE_LABEL[figure], numeric: true, render: (r) => <ValueWithError value={r.figures[figure]?.value} uncertainty={r.figures[figure]?.sigma} /> },
    { key: "pair", header: "Pair rate (/s)", numeric: true, render: (r) => <ValueWithError value={r.pairRate?.value} uncertainty={r.pairRate?.sigma} /> },
    { key: "acc", header: "Accidentals (/s)", numeric: true, render: (r) => <ValueWithError value={r.accidentalRate} significant={3} /> },
    { key: "notes", header: "Notes", render: (r) => <span className="text-xs text-ink-soft">{r.notes.join(" ")}</span> },
  ];
  if (trend.runs.length === 0) {
    return <EmptyState title="No runs here yet">Record tomography, Bell-test or fringe-scan runs in this {trend.scope.kind}; their figures appear here, one point per run.</EmptyState>;
  }
  return (
    <div className="space-y-4">
      {plotted === 0 && (
        <Alert kind="info" title="Nothing to plot for this pair of axes">
          No run has both “{FIGURE_LABEL[figure]}” and “{X_LABEL[x]}”. Pick another figure or parameter{missingX ? `; ${missingX} run(s) do not record this parameter` : ""}.
        </Alert>
      )}
      <div className="grid gap-4 xl:grid-cols-2">
        <ChartFrame
          title={`${FIGURE_LABEL[figure]} against ${X_LABEL[x].replace(/ \(.*\)$/, "").toLowerCase()}`}
          fileName={`${trend.scope.title} ${figure} vs ${x}`}
          caption={`One marker per run, ±1σ error bars (Monte Carlo for reconstructed figures, Poisson for measured ones); ${trend.method === "mle" ? "maximum likelihood" : trend.method}, accidentals ${trend.accidentals ? "subtracted" : "not subtracted"}.`}
        >
          <TrendChart series={figureSeries} x={xAxis} y={{ label: FIGURE_LABEL[figure] }} />
        </ChartFrame>
        <ChartFrame
          title="Pair rate and accidentals"
          fileName={`${trend.scope.title} rates vs ${x}`}
          caption="Left axis: coincidences per second summed over one complete analyser basis (e.g. HH + HV + VH + VV), ±1σ. Right axis: accidental coincidences per second, singles A × singles B × window τ (needs singles and the session's window)."
        >
          <TrendChart series={[...pairSeries, ...accidentalSeries]} x={xAxis} y={{ label: "Pair rate (/s)" }} yRight={accidentalSeries.length ? { label: "Accidentals (/s)" } : undefined} />
        </ChartFrame>
      </div>
      <DataTable caption={`Runs of ${trend.scope.title}, by ${X_LABEL[x].replace(/ \(.*\)$/, "").toLowerCase()}`} columns={columns} rows={byX(trend.runs, x)} rowKey={(r) => r.runId} />
    </div>
  );
}
