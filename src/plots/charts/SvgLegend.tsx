import { useChartWidth, usePlotArea } from "recharts";
import { CHART, type SeriesStyle } from "./chartTheme";

export interface LegendEntry {
  label: string;
  style: SeriesStyle;
  /** "marker" draws the series' marker, "line" a line sample (dashed when `dashed`), "both" a line through a marker. */
  kind: "marker" | "line" | "both";
  dashed?: boolean;
}

const ROW_HEIGHT = 18;
const CHAR_WIDTH = 6.6;
const SAMPLE_WIDTH = 32;

/** Width the legend needs; charts add it to their right margin so the legend never covers data. */
export function legendWidth(entries: LegendEntry[]): number {
  if (entries.length === 0) return 0;
  return Math.ceil(SAMPLE_WIDTH + 8 + Math.max(...entries.map((e) => e.label.length)) * CHAR_WIDTH);
}

/**
 * A legend drawn inside the chart's SVG (Recharts' own legend is HTML, so it would be missing
 * from saved figures), in the right margin beside the plot area.
 */
export function SvgLegend({ entries }: { entries: LegendEntry[] }) {
  const plot = usePlotArea();
  const chartWidth = useChartWidth();
  if (!plot || !chartWidth || entries.length === 0) return null;
  const width = legendWidth(entries);
  const x = chartWidth - width - 2;
  const y = plot.y;
  return (
    <g aria-hidden="true">
      {entries.map((e, i) => {
        const cy = y + ROW_HEIGHT * i + ROW_HEIGHT / 2;
        return (
          <g key={e.label}>
            {e.kind !== "marker" && <line x1={x + 2} x2={x + 26} y1={cy} y2={cy} stroke={e.style.colour} strokeWidth={2} strokeDasharray={e.dashed ? "5 3" : undefined} />}
            {e.kind !== "line" && <Marker cx={x + 14} cy={cy} style={e.style} />}
            <text x={x + SAMPLE_WIDTH} y={cy + 4} fontSize={12} fill={CHART.ink}>
              {e.label}
            </text>
          </g>
        );
      })}
    </g>
  );
}

/** The marker of a series, also used as Recharts' scatter `shape`. Hollow shapes are outlined. */
export function Marker({ cx, cy, style, size = 4.5 }: { cx?: number; cy?: number; style: SeriesStyle; size?: number }) {
  if (cx === undefined || cy === undefined || !Number.isFinite(cx) || !Number.isFinite(cy)) return null;
  const paint = style.hollow ? { fill: "#ffffff", stroke: style.colour, strokeWidth: 1.75 } : { fill: style.colour };
  switch (style.shape) {
    case "square":
      return <rect x={cx - size} y={cy - size} width={2 * size} height={2 * size} {...paint} />;
    case "triangle":
      return <polygon points={`${cx},${cy - size * 1.2} ${cx + size * 1.1},${cy + size * 0.8} ${cx - size * 1.1},${cy + size * 0.8}`} {...paint} />;
    case "diamond":
      return <polygon points={`${cx},${cy - size * 1.3} ${cx + size},${cy} ${cx},${cy + size * 1.3} ${cx - size},${cy}`} {...paint} />;
    default:
      return <circle cx={cx} cy={cy} r={size} {...paint} />;
  }
}
