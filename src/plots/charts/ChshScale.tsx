import { CartesianGrid, ComposedChart, ErrorBar, ReferenceArea, ReferenceLine, ResponsiveContainer, Scatter, XAxis, YAxis } from "recharts";
import { AXIS_LABEL, AXIS_TICK, CHART, seriesStyle } from "./chartTheme";
import { Marker } from "./SvgLegend";

export interface ChshMark {
  label: string;
  value: number;
  sigma: number;
}

const TSIRELSON = 2 * Math.SQRT2;

/**
 * |S| on a number line up to 3 with the local-realist bound 2 and the Tsirelson bound 2√2
 * (Clauser et al., PRL 23, 880 (1969); Tsirelson, Lett. Math. Phys. 4, 93 (1980)); one row per mark.
 */
export function ChshScale({ marks }: { marks: ChshMark[] }) {
  const data = marks.map((m, i) => ({ ...m, row: i }));
  // Start at 1.5 so that values near the bounds stay apart; lower only when a mark needs it.
  const low = Math.min(1.5, Math.floor(2 * Math.min(...marks.map((m) => m.value - m.sigma))) / 2);
  const step = low < 1 ? 0.5 : 0.25;
  const ticks = Array.from({ length: Math.round((3 - low) / step) + 1 }, (_, i) => low + step * i);
  return (
    <ResponsiveContainer width="100%" height="100%">
      <ComposedChart layout="vertical" margin={{ top: 20, right: 24, bottom: 28, left: 8 }}>
        <CartesianGrid stroke={CHART.grid} horizontal={false} />
        <ReferenceArea x1={low} x2={2} fill={CHART.grid} fillOpacity={0.6} />
        <XAxis type="number" dataKey="value" domain={[low, 3]} ticks={ticks} tick={AXIS_TICK} stroke={CHART.faint} label={{ value: "|S|", position: "insideBottom", offset: -16, ...AXIS_LABEL }} />
        <YAxis type="number" dataKey="row" domain={[-0.6, marks.length - 0.4]} ticks={marks.map((_, i) => i)} tickFormatter={(i: number) => marks[i]?.label ?? ""} reversed width={170} tick={AXIS_TICK} stroke={CHART.faint} />
        <ReferenceLine x={2} stroke={CHART.ink} strokeWidth={1.5} label={{ value: "local bound 2", position: "top", fill: CHART.ink, fontSize: 12 }} />
        <ReferenceLine x={TSIRELSON} stroke={CHART.caution} strokeDasharray="5 3" label={{ value: "2√2", position: "top", fill: CHART.caution, fontSize: 12 }} />
        <Scatter data={data} dataKey="value" isAnimationActive={false} shape={(p: { cx?: number; cy?: number; payload?: { row: number } }) => <Marker cx={p.cx} cy={p.cy} style={seriesStyle(p.payload?.row ?? 0)} size={5.5} />}>
          <ErrorBar isAnimationActive={false} dataKey="sigma" direction="x" stroke={CHART.ink} width={5} />
        </Scatter>
      </ComposedChart>
    </ResponsiveContainer>
  );
}
