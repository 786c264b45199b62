import { In, type EntityManager } from "typeorm";
import type { ShareItemType } from "@shared/schemas/shares";
import { db } from "../db/dataSource";
import { Lab } from "../entities/Lab";
import type { LabSession } from "../entities/LabSession";
import { Reconstruction } from "../entities/Reconstruction";
import { Run } from "../entities/Run";
import { RunRevision } from "../entities/RunRevision";
import { notFound } from "../http/errors";
import { findLabSession } from "./labSessions";
import { findReconstruction } from "./reconstructions";
import { findRun } from "./runQueries";

/** One run as a snapshot shows it: the revision whose counts are shown and its reconstructions. */
export interface SnapshotRunData {
  run: Run;
  shown: RunRevision;
  revisions: RunRevision[];
  /** Newest first. */
  reconstructions: Reconstruction[];
}

/** Everything one shared item (or report) may show, loaded; the presenter picks the fields. */
export interface SnapshotData {
  itemType: ShareItemType;
  lab: Lab;
  /** With `source` loaded. */
  labSession: LabSession;
  runs: SnapshotRunData[];
  focusReconstructionId: string | null;
}

/**
 * Loads exactly the item: a session brings its runs (current counts and their reconstructions);
 * a run brings only itself; a reconstruction brings only itself and the counts it used.
 * Nothing else of the lab is read, so nothing else can be shown. 404 if the item is not in `labId`.
 */
export async function loadSnapshotData(labId: string, itemType: ShareItemType, itemId: string, em: EntityManager = db().manager): Promise<SnapshotData> {
  const lab = await em.findOneBy(Lab, { id: labId });
  if (!lab) throw notFound("Lab");
  if (itemType === "reconstruction") {
    const { reconstruction } = await findReconstruction(labId, itemId, em);
    const run = await findRun(labId, reconstruction.runId, em);
    const revisions = await revisionsOf([run.id], em);
    const shown = revisions.find((r) => r.id === reconstruction.revisionId)!;
    return { itemType, lab, labSession: run.session!, runs: [{ run, shown, revisions, reconstructions: [reconstruction] }], focusReconstructionId: reconstruction.id };
  }
  if (itemType === "run") {
    const run = await findRun(labId, itemId, em);
    return { itemType, lab, labSession: run.session!, runs: await withCurrentCounts([run], em), focusReconstructionId: null };
  }
  const labSession = await findLabSession(labId, itemId, em);
  const runs = await em.find(Run, { where: { labId, sessionId: labSession.id }, order: { createdAt: "ASC", id: "ASC" } });
  return { itemType, lab, labSession, runs: await withCurrentCounts(runs, em), focusReconstructionId: null };
}

async function revisionsOf(runIds: string[], em: EntityManager): Promise<RunRevision[]> {
  if (!runIds.length) return [];
  return em.find(RunRevision, { where: { runId: In(runIds) }, order: { number: "ASC" } });
}

async function withCurrentCounts(runs: Run[], em: EntityManager): Promise<SnapshotRunData[]> {
  const revisions = await revisionsOf(runs.map((r) => r.id), em);
  const current = runs.map((run) => revisions.find((r) => r.runId === run.id && r.number === run.currentRevision)!);
  const reconstructions = current.length ? await em.find(Reconstruction, { where: { revisionId: In(current.map((r) => r.id)) }, order: { createdAt: "DESC", id: "DESC" } }) : [];
  return runs.map((run, i) => ({
    run,
    shown: current[i],
    revisions: revisions.filter((r) => r.runId === run.id),
    reconstructions: reconstructions.filter((r) => r.revisionId === current[i].id),
  }));
}

/** Display names of shared items, for the lab's share list ("5 mW — maximum likelihood"). */
export async function itemTitles(items: Array<{ itemType: ShareItemType; itemId: string }>, em: EntityManager = db().manager): Promise<Map<string, string>> {
  const ids = (type: ShareItemType) => items.filter((i) => i.itemType === type).map((i) => i.itemId);
  const titles = new Map<string, string>();
  const sessionIds = ids("session");
  if (sessionIds.length) for (const s of await em.query(`SELECT id, title FROM lab_sessions WHERE id = ANY($1)`, [sessionIds])) titles.set(s.id, s.title);
  const runIds = ids("run");
  if (runIds.length) for (const r of await em.query(`SELECT id, name FROM runs WHERE id = ANY($1)`, [runIds])) titles.set(r.id, r.name);
  const recIds = ids("reconstruction");
  if (recIds.length) {
    const rows = await em.query(`SELECT rc.id, rc.method, r.name FROM reconstructions rc JOIN runs r ON r.id = rc.run_id WHERE rc.id = ANY($1)`, [recIds]);
    for (const r of rows) titles.set(r.id, `${r.name} — ${METHOD_WORDS[r.method as Reconstruction["method"]]}`);
  }
  return titles;
}

export const METHOD_WORDS: Record<Reconstruction["method"], string> = {
  linear: "linear inversion",
  mle: "maximum likelihood",
  projected: "projected least squares",
};
