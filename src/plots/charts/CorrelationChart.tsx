import { CartesianGrid, ComposedChart, ErrorBar, ReferenceLine, ResponsiveContainer, Scatter, Tooltip, XAxis, YAxis } from "recharts";
import { formatWithUncertainty } from "@shared/format/uncertainty";
import { AXIS_LABEL, AXIS_TICK, CHART, seriesStyle } from "./chartTheme";
import { type LegendEntry, Marker, SvgLegend, legendWidth } from "./SvgLegend";

export interface CorrelationPoint {
  /** e.g. "E(a, b)" */
  label: string;
  measured: number;
  sigma: number;
  predicted: number | null;
}

/** The four correlations of a CHSH test: measured ± σ beside what ρ predicts, on [−1, 1]. */
export function CorrelationChart({ points }: { points: CorrelationPoint[] }) {
  const data = points.map((p, i) => ({ ...p, index: i }));
  const predicted = data.filter((p) => p.predicted !== null);
  const tick = (i: number) => points[i]?.label ?? "";
  const legend: LegendEntry[] = [
    { label: "measured ± σ", style: seriesStyle(0), kind: "marker" },
    ...(predicted.length ? [{ label: "predicted by ρ", style: seriesStyle(1), kind: "marker" as const }] : []),
  ];
  return (
    <ResponsiveContainer width="100%" height="100%">
      <ComposedChart margin={{ top: 12, right: 20 + legendWidth(legend), bottom: 28, left: 24 }}>
        <CartesianGrid stroke={CHART.grid} />
        <XAxis type="number" dataKey="index" domain={[-0.5, points.length - 0.5]} ticks={points.map((_, i) => i)} tickFormatter={tick} tick={AXIS_TICK} stroke={CHART.faint} label={{ value: "Analyser pair", position: "insideBottom", offset: -16, ...AXIS_LABEL }} />
        <YAxis type="number" domain={[-1, 1]} ticks={[-1, -0.5, 0, 0.5, 1]} tick={AXIS_TICK} stroke={CHART.faint} label={{ value: "Correlation E", angle: -90, position: "insideLeft", offset: -4, style: { textAnchor: "middle" }, ...AXIS_LABEL }} />
        <ReferenceLine y={0} stroke={CHART.faint} />
        <Tooltip formatter={(value, name, item) => [formatWithUncertainty(Number(value), name === "measured" ? (item?.payload as CorrelationPoint).sigma : null).text, name]} labelFormatter={() => ""} />
        <Scatter data={data} dataKey="measured" name="measured" isAnimationActive={false} shape={(p: { cx?: number; cy?: number }) => <Marker cx={p.cx === undefined ? undefined : p.cx - 7} cy={p.cy} style={seriesStyle(0)} />}>
          <ErrorBar isAnimationActive={false} dataKey="sigma" direction="y" stroke={seriesStyle(0).colour} width={4} />
        </Scatter>
        {predicted.length > 0 && (
          <Scatter data={predicted} dataKey="predicted" name="predicted by ρ" isAnimationActive={false} shape={(p: { cx?: number; cy?: number }) => <Marker cx={p.cx === undefined ? undefined : p.cx + 7} cy={p.cy} style={seriesStyle(1)} />} />
        )}
        <SvgLegend entries={legend} />
      </ComposedChart>
    </ResponsiveContainer>
  );
}
