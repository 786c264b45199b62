/**
 * Colours and marker shapes of the 2D charts, from the palette in tailwind.config.ts. Series
 * differ by colour and by marker shape (and the predicted series by a dashed line), so no
 * chart relies on colour alone; petrol, blue and orange stay distinct for the common forms of
 * colour blindness.
 */
export const CHART = {
  ink: "#17212b",
  inkSoft: "#3d4a57",
  faint: "#65717d",
  grid: "#ece8de",
  caution: "#8a5a00",
} as const;

export interface SeriesStyle {
  colour: string;
  shape: "circle" | "square" | "triangle" | "diamond";
  /** Outlined instead of filled: the second round of styles. */
  hollow?: boolean;
}

/** Eight styles; neighbours differ in colour and in shape. */
export const SERIES: SeriesStyle[] = [
  { colour: "#0d5c63", shape: "circle" },
  { colour: "#c8661a", shape: "square" },
  { colour: "#2b5fb0", shape: "triangle" },
  { colour: "#3d4a57", shape: "diamond" },
  { colour: "#0d5c63", shape: "square", hollow: true },
  { colour: "#c8661a", shape: "triangle", hollow: true },
  { colour: "#2b5fb0", shape: "diamond", hollow: true },
  { colour: "#3d4a57", shape: "circle", hollow: true },
];

export const seriesStyle = (i: number): SeriesStyle => SERIES[i % SERIES.length];

export const AXIS_TICK = { fill: CHART.inkSoft, fontSize: 12 };
export const AXIS_LABEL = { fill: CHART.ink, fontSize: 13 };
