/**
 * Bell-test analysis of a stored run: CHSH from its current counts (shared/physics/bell) beside
 * what a reconstructed ρ of the same session predicts at the same angles and at best.
 */
import type { EntityManager } from "typeorm";
import { EngineInputError } from "@shared/physics/errors";
import { analyseBellRun, predictedChsh } from "@shared/physics/bell";
import type { BellTestDto, BellTestQuery } from "@shared/schemas/bell";
import type { RunKind } from "@shared/schemas/runs";
import { db } from "../db/dataSource";
import { Reconstruction } from "../entities/Reconstruction";
import { Run } from "../entities/Run";
import { RunRevision } from "../entities/RunRevision";
import { invalid, notFound } from "../http/errors";
import { engineRows } from "./runRows";

export interface RunWithRows {
  run: Run;
  revision: RunRevision;
}

/** A run of this lab with its current revision; 404 if absent, 400 if it is another kind of run. */
export async function runWithCurrentRows(labId: string, runId: string, kind: RunKind, em: EntityManager = db().manager): Promise<RunWithRows> {
  const run = await em.findOne(Run, { where: { id: runId, labId }, relations: { session: true } });
  if (!run) throw notFound("Run");
  if (run.kind !== kind) throw invalid("runId", `This is a ${run.kind} run; this analysis is for ${kind} runs.`);
  const revision = await em.findOneOrFail(RunRevision, { where: { runId, number: run.currentRevision } });
  return { run, revision };
}

/** Engine input errors (they name the row and arm) become 400s on the rows. */
export function engineResult<T>(compute: () => T): T {
  try {
    return compute();
  } catch (e) {
    if (e instanceof EngineInputError) throw invalid("rows", e.message);
    throw e;
  }
}

export async function bellTest(labId: string, runId: string, query: BellTestQuery): Promise<BellTestDto> {
  const { run, revision } = await runWithCurrentRows(labId, runId, "bell");
  const angles = query.aDeg !== undefined ? { aDeg: query.aDeg, aPrimeDeg: query.aPrimeDeg!, bDeg: query.bDeg!, bPrimeDeg: query.bPrimeDeg! } : undefined;
  const result = engineResult(() => analyseBellRun(engineRows(revision.rows, null), angles));
  const compared = await comparisonReconstruction(labId, run.sessionId, query.reconstructionId);
  const predicted = compared && predictedChsh(compared.reconstruction.rho, result.angles);
  return {
    runId: run.id,
    runName: run.name,
    sessionId: run.sessionId,
    revisionNumber: revision.number,
    angles: result.angles,
    anglesOrigin: result.anglesOrigin,
    correlations: result.correlations.map((c, i) => ({ ...c, predicted: predicted ? predicted.correlations[i].value : null })),
    s: result.s,
    sigmaS: result.sigmaS,
    significance: Number.isFinite(result.significance) ? result.significance : null,
    totalCounts: result.totalCounts,
    prediction:
      compared && predicted
        ? {
            reconstructionId: compared.reconstruction.id,
            runId: compared.run.id,
            runName: compared.run.name,
            method: compared.reconstruction.method,
            physical: compared.reconstruction.physical,
            s: predicted.s,
            maximum: predicted.maximum,
            maximumSigma: compared.reconstruction.uncertainties?.metrics.chshMax ?? null,
          }
        : null,
    predictionNote: compared ? null : "No tomography run of this session has a maximum-likelihood reconstruction yet, so there is no ρ to compare with.",
  };
}

/** The chosen reconstruction (any two-photon ρ of this lab), or the session's newest MLE of a tomography run. */
async function comparisonReconstruction(labId: string, sessionId: string, reconstructionId?: string): Promise<{ reconstruction: Reconstruction; run: Run } | null> {
  const em = db().manager;
  if (reconstructionId) {
    const reconstruction = await em.findOne(Reconstruction, { where: { id: reconstructionId, labId } });
    if (!reconstruction) throw notFound("Reconstruction");
    if (reconstruction.rho.re.length !== 4) throw invalid("reconstructionId", "That reconstruction is not of a two-photon state.");
    return { reconstruction, run: await em.findOneByOrFail(Run, { id: reconstruction.runId }) };
  }
  const reconstruction = await em
    .createQueryBuilder(Reconstruction, "r")
    .innerJoin(Run, "run", "run.id = r.run_id")
    .innerJoin(RunRevision, "rev", "rev.id = r.revision_id AND rev.number = run.current_revision")
    .where("run.lab_id = :labId AND run.session_id = :sessionId AND run.kind = 'tomography' AND r.method = 'mle'", { labId, sessionId })
    .orderBy("r.created_at", "DESC")
    .addOrderBy("r.id", "ASC")
    .getOne();
  if (!reconstruction || reconstruction.rho.re.length !== 4) return null;
  return { reconstruction, run: await em.findOneByOrFail(Run, { id: reconstruction.runId }) };
}
