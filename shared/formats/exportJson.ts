/**
 * Export JSON files (our layouts; the zod schemas in shared/schemas/exports.ts describe them and
 * README "Sharing and exports" documents them): rho.json (ρ with σ, basis order and eigenvalues)
 * and metrics.json (figures of merit with σ, one item per reconstruction). Only results and
 * their parameters are written — never people, e-mail addresses or ids.
 */
import { basisLabels } from "../physics/reconstruct";
import { METRIC_KEYS, type ReconstructionDto } from "../schemas/reconstructions";
import type { ExportContext, MetricsExport, RhoExport } from "../schemas/exports";

/** What an export needs of a reconstruction: the lab's DTO and a shared snapshot both have it. */
export type ExportableReconstruction = Pick<ReconstructionDto, "method" | "corrections" | "physical" | "uncertainties" | "engineVersion" | "createdAt" | "rho" | "eigenvalues" | "metrics">;

function methodPart(r: ExportableReconstruction): RhoExport["reconstruction"] {
  return {
    method: r.method,
    corrections: r.corrections,
    physical: r.physical,
    monteCarlo: r.uncertainties ? { samples: r.uncertainties.samples, seed: r.uncertainties.seed } : null,
    engineVersion: r.engineVersion,
    computedAt: r.createdAt,
  };
}

export function rhoJson(context: ExportContext, r: ExportableReconstruction): RhoExport {
  return {
    format: "rhomb-density-matrix",
    formatVersion: 1,
    context,
    reconstruction: methodPart(r),
    basis: basisLabels(Math.round(Math.log2(r.rho.re.length))),
    real: r.rho.re,
    imaginary: r.rho.im,
    sigmaReal: r.uncertainties?.rho.re ?? null,
    sigmaImaginary: r.uncertainties?.rho.im ?? null,
    eigenvalues: r.eigenvalues,
  };
}

export function metricsJson(items: Array<{ context: ExportContext; reconstruction: ExportableReconstruction }>): MetricsExport {
  return {
    format: "rhomb-figures-of-merit",
    formatVersion: 1,
    items: items.map(({ context, reconstruction: r }) => ({
      context,
      reconstruction: methodPart(r),
      figures: Object.fromEntries(METRIC_KEYS.map((k) => [k, { value: r.metrics[k], sigma: r.uncertainties?.metrics[k] ?? null }])),
    })),
  };
}

/** Pretty JSON with a final newline, as every JSON file we write. */
export const jsonText = (value: unknown) => JSON.stringify(value, null, 2) + "\n";
