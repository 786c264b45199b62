/**
 * rhomb bench FILE.csv --repeat N [--window-ns T] [--handedness …] [--json]
 *
 * Median in-process wall time of one maximum-likelihood reconstruction (parsed rows in, the
 * full Reconstruction out) over N timed runs after a warm-up, and the log-likelihood reached.
 */
import { parseArgs } from "node:util";
import { reconstruct } from "@shared/physics";
import { CliInputError, readTomographyFile, reportInputError } from "./tomographyInput";

const WARM_UP_MS = 300;

export async function run(args: string[]): Promise<number> {
  let file: string | undefined;
  try {
    const { values, positionals } = parseArgs({
      args,
      allowPositionals: true,
      options: {
        repeat: { type: "string", default: "200" },
        "window-ns": { type: "string" },
        handedness: { type: "string" },
        json: { type: "boolean", default: false },
      },
    });
    file = positionals[0];
    const repeat = Number(values.repeat);
    if (!Number.isInteger(repeat) || repeat < 1) throw new CliInputError(`--repeat must be a whole number ≥ 1, not "${values.repeat}"`);
    const { input, windowNs } = readTomographyFile(file, values.handedness, values["window-ns"]);
    const options = { method: "mle" as const, ...(windowNs !== undefined && { windowNs }) };

    const result = reconstruct(input, options);
    const warmUpEnd = performance.now() + WARM_UP_MS;
    while (performance.now() < warmUpEnd) reconstruct(input, options);
    const times: number[] = [];
    for (let i = 0; i < repeat; i++) {
      const t0 = performance.now();
      reconstruct(input, options);
      times.push(performance.now() - t0);
    }
    times.sort((a, b) => a - b);
    const mid = times.length >> 1;
    const median = times.length % 2 ? times[mid] : (times[mid - 1] + times[mid]) / 2;
    if (values.json) {
      process.stdout.write(`${JSON.stringify({ msPerReconstruction: median, logLikelihood: result.logLikelihood, repeat, iterations: result.iterations, converged: result.converged })}\n`);
    } else {
      process.stdout.write(
        `${file}: median ${median.toFixed(4)} ms per maximum-likelihood reconstruction over ${repeat} runs (after ${WARM_UP_MS} ms warm-up); ` +
          `L = ${result.logLikelihood} after ${result.iterations} iterations${result.converged ? "" : " (NOT converged)"}\n`,
      );
    }
    return 0;
  } catch (error) {
    return reportInputError(error, file);
  }
}
