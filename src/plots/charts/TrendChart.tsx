import { CartesianGrid, ComposedChart, ErrorBar, ResponsiveContainer, Scatter, Tooltip, XAxis, YAxis } from "recharts";
import { formatWithUncertainty } from "@shared/format/uncertainty";
import { AXIS_LABEL, AXIS_TICK, CHART, seriesStyle } from "./chartTheme";
import { type LegendEntry, Marker, SvgLegend, legendWidth } from "./SvgLegend";

export interface TrendPoint {
  x: number;
  y: number;
  /** Standard uncertainty of y; 0 draws no bar. */
  sigma: number;
  label: string;
}

export interface TrendSeries {
  label: string;
  points: TrendPoint[];
  /** Index into the series styles (default: the series' position). */
  styleIndex?: number;
  /** Which y-axis (two when the quantities differ in size, e.g. pair rate and accidentals). */
  axis?: "left" | "right";
}

export interface TrendAxis {
  label: string;
  /** Formats tick values (e.g. dates); defaults to plain numbers. */
  tickFormat?: (v: number) => string;
}

/** A figure against a parameter: one marker per run with its error bar, one series per group. */
export function TrendChart({ series, x, y, yRight }: { series: TrendSeries[]; x: TrendAxis; y: TrendAxis; yRight?: TrendAxis }) {
  const style = (s: TrendSeries, i: number) => seriesStyle(s.styleIndex ?? i);
  const legend: LegendEntry[] = series.length > 1 ? series.map((s, i) => ({ label: s.label, style: style(s, i), kind: "marker" })) : [];
  return (
    <ResponsiveContainer width="100%" height="100%">
      <ComposedChart margin={{ top: 12, right: (yRight ? 28 : 20) + legendWidth(legend), bottom: 28, left: 24 }}>
        <CartesianGrid stroke={CHART.grid} />
        <XAxis type="number" dataKey="x" domain={["auto", "auto"]} tick={AXIS_TICK} tickFormatter={x.tickFormat} stroke={CHART.faint} label={{ value: x.label, position: "insideBottom", offset: -16, ...AXIS_LABEL }} />
        <YAxis yAxisId="left" type="number" domain={["auto", "auto"]} tick={AXIS_TICK} tickFormatter={y.tickFormat} stroke={CHART.faint} label={{ value: y.label, angle: -90, position: "insideLeft", offset: -10, style: { textAnchor: "middle" }, ...AXIS_LABEL }} />
        {yRight && (
          <YAxis yAxisId="right" orientation="right" type="number" domain={["auto", "auto"]} tick={AXIS_TICK} tickFormatter={yRight.tickFormat} stroke={CHART.faint} label={{ value: yRight.label, angle: 90, position: "insideRight", offset: -10, style: { textAnchor: "middle" }, ...AXIS_LABEL }} />
        )}
        <Tooltip
          formatter={(value, name, item) => {
            const p = item?.payload as TrendPoint | undefined;
            return [formatWithUncertainty(Number(value), p?.sigma || null).text, `${name}${p ? ` — ${p.label}` : ""}`];
          }}
          labelFormatter={() => ""}
        />
        {series.map((s, i) => (
          <Scatter key={s.label} yAxisId={s.axis ?? "left"} data={s.points} dataKey="y" name={s.label} isAnimationActive={false} shape={(p: { cx?: number; cy?: number }) => <Marker cx={p.cx} cy={p.cy} style={style(s, i)} />}>
            <ErrorBar isAnimationActive={false} dataKey="sigma" direction="y" stroke={style(s, i).colour} width={4} />
          </Scatter>
        ))}
        <SvgLegend entries={legend} />
      </ComposedChart>
    </ResponsiveContainer>
  );
}
