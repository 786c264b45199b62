import { randomInt } from "node:crypto";
import type { EntityManager } from "typeorm";
import type { CreateReconstruction, Corrections } from "@shared/schemas/reconstructions";
import type { CountsRowDto, CreateRevision, CreateRun, UpdateRun } from "@shared/schemas/runs";
import { LIMITS } from "@shared/limits";
import { db } from "../db/dataSource";
import { Attachment } from "../entities/Attachment";
import type { LabSession } from "../entities/LabSession";
import { Reconstruction } from "../entities/Reconstruction";
import { Run } from "../entities/Run";
import { RunRevision } from "../entities/RunRevision";
import type { AuthUser } from "../http/auth";
import { fieldChanges, recordAudit } from "./audit";
import { computeReconstruction, type ComputedReconstruction } from "./engine";
import { findLabSession } from "./labSessions";
import { findRun, loadRunDetail, type RunDetail } from "./runQueries";
import { rowChanges, totalCounts } from "./runRows";

/** The reconstructions computed whenever counts are saved: linear inversion and maximum likelihood. */
const ON_SAVE = ["linear", "mle"] as const;

export interface UploadedFile {
  fileName: string;
  contentType: string;
  content: Buffer;
  sha256: string;
}

/**
 * Saves a run: computes its reconstructions first (outside the transaction, so a slow Monte
 * Carlo holds no locks), then stores run, revision 1, reconstructions, the uploaded file and the
 * audit entry in one transaction — all of it or nothing. Bell and fringe runs are stored
 * without a tomographic reconstruction.
 */
export async function createRun(user: AuthUser, labId: string, sessionId: string, input: CreateRun, file?: UploadedFile): Promise<RunDetail> {
  const labSession = await findLabSession(labId, sessionId);
  const computed = input.kind === "tomography" ? await computeOnSave(labSession, input.settingSetId, input.rows, input.reconstruction, "reconstruction.corrections") : [];
  return db().transaction(async (em) => {
    const run = await storeRun(em, user, labSession, input, computed, file);
    return loadRunDetail(labId, run.id, em);
  });
}

/** The writes of a new run inside the caller's transaction (the API's and the demo seed's). */
export async function storeRun(em: EntityManager, user: AuthUser, labSession: LabSession, input: CreateRun, computed: ComputedReconstruction[], file?: UploadedFile): Promise<{ id: string; revisionId: string }> {
  const { labId } = labSession;
  const run = await em.save(
    em.create(Run, { labId, sessionId: labSession.id, kind: input.kind, settingSetId: input.settingSetId, name: input.name, notes: input.notes, conditions: input.conditions, currentRevision: 1, createdById: user.id }),
  );
  const revision = await saveRevision(em, user, run, 1, input.rows, "", []);
  await saveReconstructions(em, user, run, revision, computed);
  if (file) await em.insert(Attachment, { labId, runId: run.id, fileName: file.fileName, contentType: file.contentType, sizeBytes: file.content.length, sha256: file.sha256, content: file.content, createdById: user.id });
  await recordAudit(em, user, {
    labId,
    action: file ? "run.upload" : "run.create",
    entityType: "run",
    entityId: run.id,
    changes: { name: input.name, kind: input.kind, settingSetId: input.settingSetId, rows: input.rows.length, ...(file && { file: file.fileName, sha256: file.sha256 }) },
  });
  return { id: run.id, revisionId: revision.id };
}

/** Name, notes and conditions only; counts never change in place. */
export async function updateRun(user: AuthUser, labId: string, runId: string, patch: UpdateRun): Promise<void> {
  await db().transaction(async (em) => {
    const run = await findRun(labId, runId, em);
    const next = patch.conditions ? { ...patch, conditions: { ...run.conditions, ...patch.conditions } } : patch;
    const changes = fieldChanges(run, next);
    if (!Object.keys(changes).length) return;
    await em.update(Run, { id: runId, labId }, next);
    await recordAudit(em, user, { labId, action: "run.update", entityType: "run", entityId: runId, changes });
  });
}

/**
 * A correction of the counts: a new revision beside the old ones (which stay, untouched), new
 * reconstructions for it, and the run pointing at it. Who changed which cell is in `changes`.
 */
export async function reviseRun(user: AuthUser, labId: string, runId: string, input: CreateRevision): Promise<RunDetail> {
  const run = await findRun(labId, runId);
  const previous = await db().manager.findOneByOrFail(RunRevision, { runId, number: run.currentRevision });
  const changes = rowChanges(previous.rows, input.rows);
  const computed = run.kind === "tomography" ? await computeOnSave(run.session!, run.settingSetId, input.rows, input.reconstruction, "reconstruction.corrections") : [];
  return db().transaction(async (em) => {
    // Lock the run so two simultaneous corrections cannot both become revision n + 1.
    const locked = await em.getRepository(Run).createQueryBuilder("r").setLock("pessimistic_write").where("r.id = :runId", { runId }).getOneOrFail();
    const number = locked.currentRevision + 1;
    const revision = await saveRevision(em, user, run, number, input.rows, input.reason, changes);
    await saveReconstructions(em, user, run, revision, computed);
    await em.update(Run, { id: runId }, { currentRevision: number });
    await recordAudit(em, user, { labId, action: "run.revise", entityType: "run", entityId: runId, changes: { revision: number, reason: input.reason, cells: changes.length } });
    return loadRunDetail(labId, runId, em);
  });
}

/** One more reconstruction of the run's current counts with the given method and corrections. */
export async function addReconstruction(user: AuthUser, labId: string, runId: string, input: CreateReconstruction): Promise<{ reconstruction: Reconstruction; revisionNumber: number }> {
  const run = await findRun(labId, runId);
  const revision = await db().manager.findOneByOrFail(RunRevision, { runId, number: run.currentRevision });
  const computed = await computeReconstruction({
    rows: revision.rows,
    settingSetId: run.settingSetId,
    labSession: run.session!,
    target: run.session!.source!.targetState,
    method: input.method,
    corrections: input.corrections,
    samples: input.monteCarloSamples,
    seed: input.seed ?? newSeed(),
    fieldPrefix: "corrections",
  });
  return db().transaction(async (em) => {
    const [reconstruction] = await saveReconstructions(em, user, run, revision, [computed]);
    await recordAudit(em, user, { labId, action: "reconstruction.create", entityType: "reconstruction", entityId: reconstruction.id, changes: { runId, method: input.method, corrections: computed.corrections } });
    return { reconstruction: await em.findOneOrFail(Reconstruction, { where: { id: reconstruction.id }, relations: { createdBy: true } }), revisionNumber: revision.number };
  });
}

/** Linear inversion and maximum likelihood of freshly saved counts; `labSession.source` must be loaded. */
export async function computeOnSave(
  labSession: LabSession,
  settingSetId: CreateRun["settingSetId"],
  rows: CountsRowDto[],
  options: { corrections: Corrections; monteCarloSamples: number } | undefined,
  fieldPrefix: string,
  seed = newSeed(),
): Promise<ComputedReconstruction[]> {
  const corrections = options?.corrections ?? { accidentals: false, windowNs: null, efficiencies: null, drift: "none" as const };
  const samples = options?.monteCarloSamples ?? LIMITS.monteCarloDefault;
  const target = labSession.source!.targetState;
  return Promise.all(ON_SAVE.map((method) => computeReconstruction({ rows, settingSetId, labSession, target, method, corrections, samples, seed, fieldPrefix })));
}

export async function saveRevision(em: EntityManager, user: AuthUser, run: Run, number: number, rows: CountsRowDto[], reason: string, changes: RunRevision["changes"]): Promise<RunRevision> {
  return em.save(em.create(RunRevision, { labId: run.labId, runId: run.id, number, rows, rowCount: rows.length, totalCounts: totalCounts(rows), reason, changes, createdById: user.id }));
}

export async function saveReconstructions(em: EntityManager, user: AuthUser, run: Pick<Run, "id" | "labId">, revision: Pick<RunRevision, "id">, computed: ComputedReconstruction[]): Promise<Reconstruction[]> {
  const saved: Reconstruction[] = [];
  for (const c of computed) saved.push(await em.save(em.create(Reconstruction, { ...c, labId: run.labId, runId: run.id, revisionId: revision.id, createdById: user.id })));
  return saved;
}

/** A Monte Carlo seed that fits the stored integer column. */
export function newSeed(): number {
  return randomInt(0, 2 ** 31 - 1);
}
