/** Bell tests: CHSH from counts, and what a density matrix predicts for the same test. */
export * from "./angles";
export * from "./chsh";
export * from "./prediction";
export * from "./settingAngles";
export * from "./bellRun";
export * from "./basisRates";
export * from "./layouts";
