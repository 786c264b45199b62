import { usePlotArea } from "recharts";
import { CHART, type SeriesStyle } from "./chartTheme";

export interface LegendEntry {
  label: string;
  style: SeriesStyle;
  /** "line" draws a line sample (dashed when `dashed`); "marker" the series' marker. */
  kind: "marker" | "line";
  dashed?: boolean;
}

/**
 * A legend drawn inside the chart's SVG (Recharts' own legend is HTML, so it would be missing
 * from saved figures). Placed at the top right of the plot area.
 */
export function SvgLegend({ entries, align = "right" }: { entries: LegendEntry[]; align?: "right" | "left" }) {
  const plot = usePlotArea();
  if (!plot || entries.length === 0) return null;
  const rowHeight = 18;
  const width = 12 + Math.max(...entries.map((e) => e.label.length)) * 6.6 + 26;
  const x = align === "right" ? plot.x + plot.width - width - 6 : plot.x + 6;
  const y = plot.y + 6;
  return (
    <g aria-hidden="true">
      <rect x={x} y={y} width={width} height={entries.length * rowHeight + 8} fill="#ffffff" fillOpacity={0.9} stroke={CHART.grid} />
      {entries.map((e, i) => {
        const cy = y + 4 + rowHeight * i + rowHeight / 2;
        return (
          <g key={e.label}>
            {e.kind === "line" ? (
              <line x1={x + 6} x2={x + 26} y1={cy} y2={cy} stroke={e.style.colour} strokeWidth={2} strokeDasharray={e.dashed ? "5 3" : undefined} />
            ) : (
              <Marker cx={x + 16} cy={cy} style={e.style} />
            )}
            <text x={x + 32} y={cy + 4} fontSize={12} fill={CHART.ink}>
              {e.label}
            </text>
          </g>
        );
      })}
    </g>
  );
}

/** The marker of a series, also used as Recharts' scatter `shape`. */
export function Marker({ cx, cy, style, size = 4.5 }: { cx?: number; cy?: number; style: SeriesStyle; size?: number }) {
  if (cx === undefined || cy === undefined || !Number.isFinite(cx) || !Number.isFinite(cy)) return null;
  const fill = style.colour;
  switch (style.shape) {
    case "square":
      return <rect x={cx - size} y={cy - size} width={2 * size} height={2 * size} fill={fill} />;
    case "triangle":
      return <polygon points={`${cx},${cy - size * 1.2} ${cx + size * 1.1},${cy + size * 0.8} ${cx - size * 1.1},${cy + size * 0.8}`} fill={fill} />;
    case "diamond":
      return <polygon points={`${cx},${cy - size * 1.3} ${cx + size},${cy} ${cx},${cy + size * 1.3} ${cx - size},${cy}`} fill={fill} />;
    default:
      return <circle cx={cx} cy={cy} r={size} fill={fill} />;
  }
}
