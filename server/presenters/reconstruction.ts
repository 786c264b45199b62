import { FIDELITY_KEY, type HeadlineDto, type ReconstructionDto } from "@shared/schemas/reconstructions";
import type { BellTarget } from "@shared/schemas/sources";
import type { LabRole } from "@shared/schemas/roles";
import type { Reconstruction } from "../entities/Reconstruction";
import { allowedActions } from "../policies/labAccess";
import { presentPerson } from "./person";

export function presentReconstruction(r: Reconstruction, revisionNumber: number, role: LabRole): ReconstructionDto {
  return {
    id: r.id,
    labId: r.labId,
    runId: r.runId,
    revisionId: r.revisionId,
    revisionNumber,
    method: r.method,
    corrections: r.corrections,
    conventions: r.conventions,
    rho: r.rho,
    eigenvalues: r.eigenvalues,
    physical: r.physical,
    metrics: r.metrics,
    uncertainties: r.uncertainties && r.monteCarloSeed !== null ? { samples: r.monteCarloSamples, seed: r.monteCarloSeed, ...r.uncertainties } : null,
    fit: { logLikelihood: r.logLikelihood, iterations: r.iterations, converged: r.converged, tolerance: r.tolerance },
    counts: { total: r.totalCounts, clippedRows: r.clippedRows },
    warnings: r.warnings,
    engineVersion: r.engineVersion,
    createdBy: presentPerson(r.createdBy),
    createdAt: r.createdAt.toISOString(),
    can: allowedActions(role),
  };
}

export function presentHeadline(r: Reconstruction, target: BellTarget): HeadlineDto {
  const key = FIDELITY_KEY[target];
  const sigma = r.uncertainties?.metrics;
  return {
    reconstructionId: r.id,
    method: r.method,
    accidentalsSubtracted: r.corrections.accidentals,
    fidelity: r.metrics[key],
    fidelityUncertainty: sigma?.[key] ?? null,
    concurrence: r.metrics.concurrence,
    concurrenceUncertainty: sigma?.concurrence ?? null,
    purity: r.metrics.purity,
    purityUncertainty: sigma?.purity ?? null,
    chshMax: r.metrics.chshMax,
    chshMaxUncertainty: sigma?.chshMax ?? null,
  };
}
