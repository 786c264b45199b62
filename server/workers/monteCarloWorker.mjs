// Entry of a Monte Carlo worker thread. Worker threads do not inherit the parent's loader
// (tsx or vitest), so register tsx here before loading the TypeScript worker.
import { register } from "tsx/esm/api";

register();
await import("./monteCarloWorker.ts");
