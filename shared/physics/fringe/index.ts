/** Fringe scans: the visibility fit, visibilities from raw extremes, and per-basis summaries. */
export * from "./fit";
export * from "./visibility";
export * from "./fringeRun";
