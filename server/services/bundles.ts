import { createHash } from "node:crypto";
import { In, type EntityManager } from "typeorm";
import { BUNDLE_FORMAT, BUNDLE_VERSION, type SessionBundle } from "@shared/schemas/bundle";
import type { ImportedBundle } from "@shared/schemas/exports";
import { bundleFileName, readSessionBundle, writeSessionBundle } from "@shared/formats/sessionBundle";
import type { ExportFile } from "@shared/formats/snapshotExports";
import { db } from "../db/dataSource";
import { Attachment } from "../entities/Attachment";
import { LabSession } from "../entities/LabSession";
import { Reconstruction } from "../entities/Reconstruction";
import { Run } from "../entities/Run";
import { RunRevision } from "../entities/RunRevision";
import { Source } from "../entities/Source";
import type { AuthUser } from "../http/auth";
import { HttpError, invalid } from "../http/errors";
import { recordAudit } from "./audit";
import { findLabSession } from "./labSessions";
import { bundleRun, bundleSession, bundleSource } from "./bundleParts";
import { totalCounts } from "./runRows";

/**
 * The whole session as a bundle (layout: shared/schemas/bundle.ts): every run with every
 * revision, reconstruction and uploaded file. Private session notes stay out unless asked for.
 */
export async function exportBundle(labId: string, sessionId: string, includePrivateNotes: boolean): Promise<ExportFile> {
  const em = db().manager;
  const labSession = await findLabSession(labId, sessionId, em);
  const runs = await em.find(Run, { where: { labId, sessionId }, order: { createdAt: "ASC", id: "ASC" } });
  const runIds = runs.map((r) => r.id);
  const revisions = runIds.length ? await em.find(RunRevision, { where: { runId: In(runIds) }, order: { number: "ASC" } }) : [];
  const reconstructions = runIds.length ? await em.find(Reconstruction, { where: { runId: In(runIds) }, order: { createdAt: "ASC", id: "ASC" } }) : [];
  const attachments = runIds.length
    ? await em.createQueryBuilder(Attachment, "a").addSelect("a.content").where("a.run_id IN (:...runIds)", { runIds }).orderBy("a.created_at", "ASC").getMany()
    : [];
  const bundle: SessionBundle = {
    format: BUNDLE_FORMAT,
    formatVersion: BUNDLE_VERSION,
    exportedAt: new Date().toISOString(),
    source: bundleSource(labSession.source!),
    session: bundleSession(labSession, includePrivateNotes),
    runs: runs.map((run) => bundleRun(run, revisions.filter((r) => r.runId === run.id), reconstructions.filter((r) => r.runId === run.id), attachments.filter((a) => a.runId === run.id))),
  };
  return { fileName: bundleFileName(labSession.title, labSession.date), contentType: "application/json; charset=utf-8", text: writeSessionBundle(bundle) };
}

/**
 * Imports a bundle into `labId` as a new session with new ids, in one transaction: all of it or
 * nothing. Every problem of the file is reported at once, each naming its field.
 */
export async function importBundle(user: AuthUser, labId: string, text: string, sourceId?: string): Promise<ImportedBundle> {
  const read = readSessionBundle(text);
  if (!read.ok) {
    const [first] = read.problems;
    throw new HttpError(400, "invalid", `The bundle cannot be imported (${read.problems.length === 1 ? "1 problem" : `${read.problems.length} problems`}; first: ${first.field}: ${first.message}). Nothing was imported.`, read.problems);
  }
  const bundle = read.bundle;
  return db().transaction(async (em) => {
    const source = await targetSource(em, user, labId, bundle, sourceId);
    const { id: sessionId } = await em.save(em.create(LabSession, { ...bundle.session, labId, sourceId: source.id, createdById: user.id }));
    const totals = { runs: 0, revisions: 0, reconstructions: 0, attachments: 0 };
    for (const [i, r] of bundle.runs.entries()) {
      const { identifiers } = await em.insert(Run, { labId, sessionId, kind: r.kind, settingSetId: r.settingSetId, name: r.name, notes: r.notes, conditions: r.conditions, currentRevision: r.currentRevision, createdById: user.id, createdAt: new Date(r.createdAt) });
      const runId = identifiers[0].id as string;
      const revisionIds = new Map<number, string>();
      for (const v of r.revisions) {
        const revision = await em.save(em.create(RunRevision, { labId, runId, number: v.number, rows: v.rows, rowCount: v.rows.length, totalCounts: totalCounts(v.rows), reason: v.reason, changes: v.changes, createdById: user.id, createdAt: new Date(v.createdAt) }));
        revisionIds.set(v.number, revision.id);
      }
      for (const c of r.reconstructions) {
        await em.insert(Reconstruction, {
          labId,
          runId,
          revisionId: revisionIds.get(c.revisionNumber)!,
          method: c.method,
          corrections: c.corrections,
          conventions: c.conventions,
          rho: c.rho,
          eigenvalues: c.eigenvalues,
          physical: c.physical,
          metrics: c.metrics,
          uncertainties: c.uncertainties ? { metrics: c.uncertainties.metrics, rho: c.uncertainties.rho } : null,
          monteCarloSamples: c.uncertainties?.samples ?? 0,
          monteCarloSeed: c.uncertainties?.seed ?? null,
          logLikelihood: c.fit.logLikelihood,
          iterations: c.fit.iterations,
          converged: c.fit.converged,
          tolerance: c.fit.tolerance,
          totalCounts: c.counts.total,
          clippedRows: c.counts.clippedRows,
          warnings: c.warnings,
          engineVersion: c.engineVersion,
          createdById: user.id,
          createdAt: new Date(c.createdAt),
        });
      }
      for (const [j, a] of r.attachments.entries()) {
        const content = checkedBytes(a, `runs.${i}.attachments.${j}`);
        await em.insert(Attachment, { labId, runId, fileName: a.fileName, contentType: a.contentType, sizeBytes: a.sizeBytes, sha256: a.sha256, content, createdById: user.id, createdAt: new Date(a.createdAt) });
      }
      totals.runs += 1;
      totals.revisions += r.revisions.length;
      totals.reconstructions += r.reconstructions.length;
      totals.attachments += r.attachments.length;
    }
    await recordAudit(em, user, { labId, action: "bundle.import", entityType: "labSession", entityId: sessionId, changes: { title: bundle.session.title, exportedAt: bundle.exportedAt, ...totals } });
    return { session: { id: sessionId, title: bundle.session.title }, source: { id: source.id, name: source.name, created: source.created }, ...totals };
  });
}

/** An attachment's bytes, checked against the size and SHA-256 the bundle states. */
function checkedBytes(a: SessionBundle["runs"][number]["attachments"][number], at: string): Buffer {
  const bytes = Buffer.from(a.contentBase64, "base64");
  if (bytes.length !== a.sizeBytes) throw invalid(`${at}.sizeBytes`, `The file “${a.fileName}” has ${bytes.length} bytes, but the bundle says ${a.sizeBytes}. Nothing was imported.`);
  if (createHash("sha256").update(bytes).digest("hex") !== a.sha256) throw invalid(`${at}.sha256`, `The file “${a.fileName}” does not match its SHA-256: it was changed or damaged. Nothing was imported.`);
  return bytes;
}

/** The source given, else the lab's source of the same name, else a new one from the bundle. */
async function targetSource(em: EntityManager, user: AuthUser, labId: string, bundle: SessionBundle, sourceId?: string): Promise<{ id: string; name: string; created: boolean }> {
  if (sourceId) {
    const given = await em.findOneBy(Source, { id: sourceId, labId });
    if (!given) throw invalid("sourceId", "This lab has no such source; pick one of its sources or leave it empty to use the bundle's.");
    return { id: given.id, name: given.name, created: false };
  }
  const [same] = await em.query(`SELECT id, name FROM sources WHERE lab_id = $1 AND lower(name) = lower($2)`, [labId, bundle.source.name]);
  if (same) return { id: same.id, name: same.name, created: false };
  const created = await em.save(em.create(Source, { ...bundle.source, labId, createdById: user.id }));
  return { id: created.id, name: created.name, created: true };
}
