import { CartesianGrid, ComposedChart, ErrorBar, Line, ResponsiveContainer, Scatter, Tooltip, XAxis, YAxis } from "recharts";
import { formatWithUncertainty } from "@shared/format/uncertainty";
import { AXIS_LABEL, AXIS_TICK, CHART, seriesStyle } from "./chartTheme";
import { type LegendEntry, Marker, SvgLegend, legendWidth } from "./SvgLegend";

export interface FringeSeries {
  label: string;
  /** Measured rates with their Poisson σ (counts per second). */
  points: { angleDeg: number; rate: number; sigma: number }[];
  /** The fitted curve, sampled densely. */
  curve: { angleDeg: number; rate: number }[];
}

/** Coincidence rate against the scanned analyser angle: data with error bars and the fitted fringe. */
export function FringeChart({ series, yLabel = "Coincidences per second" }: { series: FringeSeries[]; yLabel?: string }) {
  const legend: LegendEntry[] = [...series.map((s, i) => ({ label: s.label, style: seriesStyle(i), kind: "both" as const })), { label: "markers: data ± σ; lines: fit", style: { colour: CHART.faint, shape: "circle" }, kind: "line" }];
  return (
    <ResponsiveContainer width="100%" height="100%">
      <ComposedChart margin={{ top: 12, right: 20 + legendWidth(legend), bottom: 28, left: 24 }}>
        <CartesianGrid stroke={CHART.grid} />
        <XAxis
          type="number"
          dataKey="angleDeg"
          domain={[0, 180]}
          ticks={[0, 30, 60, 90, 120, 150, 180]}
          tick={AXIS_TICK}
          stroke={CHART.faint}
          label={{ value: "Analyser angle θ (°)", position: "insideBottom", offset: -16, ...AXIS_LABEL }}
          allowDuplicatedCategory={false}
        />
        <YAxis type="number" tick={AXIS_TICK} stroke={CHART.faint} label={{ value: yLabel, angle: -90, position: "insideLeft", offset: -10, style: { textAnchor: "middle" }, ...AXIS_LABEL }} />
        <Tooltip
          cursor={{ stroke: CHART.faint, strokeDasharray: "3 3" }}
          formatter={(value, _name, item) => {
            const sigma = (item?.payload as { sigma?: number } | undefined)?.sigma;
            return [formatWithUncertainty(Number(value), sigma).text, "rate"];
          }}
          labelFormatter={(label) => `θ = ${label}°`}
        />
        {series.map((s, i) => (
          <Line key={`fit-${s.label}`} data={s.curve} dataKey="rate" name={`${s.label} fit`} dot={false} activeDot={false} stroke={seriesStyle(i).colour} strokeWidth={1.75} isAnimationActive={false} type="monotone" />
        ))}
        {series.map((s, i) => (
          <Scatter key={`data-${s.label}`} data={s.points} dataKey="rate" name={s.label} isAnimationActive={false} shape={(p: { cx?: number; cy?: number }) => <Marker cx={p.cx} cy={p.cy} style={seriesStyle(i)} />}>
            <ErrorBar isAnimationActive={false} dataKey="sigma" direction="y" stroke={seriesStyle(i).colour} width={4} />
          </Scatter>
        ))}
        <SvgLegend entries={legend} />
      </ComposedChart>
    </ResponsiveContainer>
  );
}
