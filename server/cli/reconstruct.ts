/**
 * rhomb reconstruct FILE.csv --method mle|linear|projected [--target phi+|phi-|psi+|psi-]
 *   [--window-ns T] [--handedness R=H+iV|R=H-iV] [--samples N [--seed S]] [--json]
 *
 * --json prints one JSON object (numbers at full double precision, nothing else on stdout);
 * otherwise a readable table. --window-ns turns on accidental subtraction from the singles
 * columns. --samples adds Monte Carlo standard deviations (spread over worker threads).
 */
import { parseArgs } from "node:util";
import {
  BELL_NAMES, figuresOfMerit, reconstruct, type BellName, type Method, type MonteCarloResult, type Reconstruction, type FiguresOfMerit,
} from "@shared/physics";
import { CliInputError, readTomographyFile, reportInputError } from "./tomographyInput";
import { formatReport } from "./reconstructReport";
import { MonteCarloPool } from "../workers/monteCarloPool";

const METHODS: readonly Method[] = ["mle", "linear", "projected"];

export async function run(args: string[]): Promise<number> {
  let file: string | undefined;
  try {
    const { values, positionals } = parseArgs({
      args,
      allowPositionals: true,
      options: {
        method: { type: "string", default: "mle" },
        target: { type: "string", default: "phi+" },
        "window-ns": { type: "string" },
        handedness: { type: "string" },
        samples: { type: "string" },
        seed: { type: "string" },
        json: { type: "boolean", default: false },
      },
    });
    file = positionals[0];
    if (positionals.length > 1) throw new CliInputError(`expected one FILE.csv, got ${positionals.length} files`);
    const method = values.method as Method;
    if (!METHODS.includes(method)) throw new CliInputError(`--method must be one of ${METHODS.join(", ")}, not "${values.method}"`);
    const target = values.target as BellName;
    if (!BELL_NAMES.includes(target)) throw new CliInputError(`--target must be one of ${BELL_NAMES.join(", ")}, not "${values.target}"`);
    const samples = values.samples === undefined ? 0 : wholeNumber(values.samples, "--samples");
    const seed = values.seed === undefined ? undefined : wholeNumber(values.seed, "--seed");

    const { input, windowNs, photons } = readTomographyFile(file, values.handedness, values["window-ns"]);
    const options = { method, ...(windowNs !== undefined && { windowNs }) };
    const result = reconstruct(input, options);
    const metrics = figuresOfMerit(result.rho, photons === 2 ? target : null);
    const uncertainties = samples > 0 ? await monteCarlo(input, options, result, samples, seed, photons === 2 ? target : null) : null;
    const output = values.json
      ? `${JSON.stringify(jsonReport(result, metrics, uncertainties))}\n`
      : formatReport(file!, result, metrics, uncertainties);
    process.stdout.write(output);
    return 0;
  } catch (error) {
    return reportInputError(error, file);
  }
}

function wholeNumber(raw: string, flag: string): number {
  if (!/^\d+$/.test(raw)) throw new CliInputError(`${flag} must be a whole number, not "${raw}"`);
  return Number(raw);
}

async function monteCarlo(
  input: Parameters<typeof reconstruct>[0],
  options: Parameters<typeof reconstruct>[1],
  base: Reconstruction,
  samples: number,
  seed: number | undefined,
  target: BellName | null,
): Promise<MonteCarloResult> {
  const pool = new MonteCarloPool();
  try {
    return await pool.run(input, options, { samples, seed, target }, base);
  } finally {
    await pool.close();
  }
}

/** The documented JSON shape: method, rho, metrics, logLikelihood, then the extras. */
export function jsonReport(r: Reconstruction, m: FiguresOfMerit, uncertainties: MonteCarloResult | null) {
  return {
    method: r.method,
    rho: r.rho,
    metrics: {
      fidelity: m.fidelity,
      concurrence: m.concurrence,
      tangle: m.tangle,
      purity: m.purity,
      linearEntropy: m.linearEntropy,
      vonNeumannEntropy: m.vonNeumannEntropy,
      negativity: m.negativity,
      chshMax: m.chshMax,
      phaseOptimisedFidelity: m.phaseOptimised?.fidelity ?? null,
      phaseOptimisedPhase: m.phaseOptimised?.phase ?? null,
    },
    logLikelihood: r.logLikelihood,
    target: m.target,
    eigenvalues: r.eigenvalues,
    physical: r.physical,
    iterations: r.iterations,
    converged: r.converged,
    tolerance: r.tolerance,
    optimalityGap: r.optimalityGap,
    photons: r.photons,
    totalCounts: r.totalCounts,
    pairRate: r.pairRate,
    clippedRows: r.clippedRows,
    corrections: r.corrections,
    conventions: r.conventions,
    uncertainties,
    warnings: r.warnings,
    engineVersion: r.engineVersion,
  };
}
