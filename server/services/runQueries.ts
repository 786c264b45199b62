import { In, type EntityManager } from "typeorm";
import type { RunListQuery } from "@shared/schemas/runs";
import { db } from "../db/dataSource";
import { Attachment } from "../entities/Attachment";
import { Reconstruction } from "../entities/Reconstruction";
import { Run } from "../entities/Run";
import { RunRevision } from "../entities/RunRevision";
import { User } from "../entities/User";
import { notFound } from "../http/errors";
import { containsPattern, pageWindow } from "./listing";

/** A run with what its summary shows: current counts and the headline reconstruction. */
export interface RunSummary {
  run: Run;
  rowCount: number;
  totalCounts: number;
  headline: Reconstruction | null;
}

export interface RunDetail extends RunSummary {
  revisions: RunRevision[];
  reconstructions: Reconstruction[];
  attachments: Attachment[];
}

/** SQL for the fidelity of a reconstruction `h` to its source's target state. */
const TARGET_FIDELITY = `(h.metrics->>(CASE s.target_state WHEN 'phi+' THEN 'fidelityPhiPlus' WHEN 'phi-' THEN 'fidelityPhiMinus' WHEN 'psi+' THEN 'fidelityPsiPlus' ELSE 'fidelityPsiMinus' END))::float8`;

const SORT_SQL: Record<RunListQuery["sort"], string> = {
  createdAt: "r.created_at",
  name: "lower(r.name)",
  kind: "r.kind",
  fidelity: TARGET_FIDELITY,
  concurrence: "(h.metrics->>'concurrence')::float8",
  purity: "(h.metrics->>'purity')::float8",
  pumpPowerMw: "COALESCE((r.conditions->>'pumpPowerMw')::float8, ls.pump_power_mw)",
};

/**
 * The headline of a run: its newest maximum-likelihood reconstruction of the current revision
 * (the one a user chose last, e.g. with accidentals subtracted).
 */
const HEADLINE_JOIN = `
  JOIN run_revisions rv ON rv.run_id = r.id AND rv.number = r.current_revision
  LEFT JOIN LATERAL (
    SELECT rc.id, rc.metrics FROM reconstructions rc
    WHERE rc.revision_id = rv.id AND rc.method = 'mle'
    ORDER BY rc.created_at DESC, rc.id DESC LIMIT 1
  ) h ON true`;

export async function listRuns(labId: string, query: RunListQuery): Promise<{ items: RunSummary[]; total: number }> {
  const params: unknown[] = [labId];
  const where = ["r.lab_id = $1"];
  const filter = (sql: (p: string) => string, value: unknown) => {
    params.push(value);
    where.push(sql(`$${params.length}`));
  };
  if (query.sessionId) filter((p) => `r.session_id = ${p}`, query.sessionId);
  if (query.sourceId) filter((p) => `ls.source_id = ${p}`, query.sourceId);
  if (query.kind) filter((p) => `r.kind = ${p}`, query.kind);
  if (query.q) filter((p) => `(r.name ILIKE ${p} OR r.notes ILIKE ${p} OR ls.title ILIKE ${p} OR s.name ILIKE ${p})`, containsPattern(query.q));
  const from = `FROM runs r JOIN lab_sessions ls ON ls.id = r.session_id JOIN sources s ON s.id = ls.source_id ${HEADLINE_JOIN} WHERE ${where.join(" AND ")}`;
  const { take, skip } = pageWindow(query.page, query.pageSize);
  const dir = query.order === "asc" ? "ASC" : "DESC";
  const [{ n }] = await db().query(`SELECT count(*) AS n ${from}`, params);
  const rows: Array<{ id: string }> = await db().query(
    `SELECT r.id ${from} ORDER BY ${SORT_SQL[query.sort]} ${dir} NULLS LAST, r.created_at DESC, r.id LIMIT ${take} OFFSET ${skip}`,
    params,
  );
  return { items: await loadRunSummaries(rows.map((r) => r.id)), total: Number(n) };
}

/** Summaries for the given run ids, in the same order. */
export async function loadRunSummaries(ids: string[], em: EntityManager = db().manager): Promise<RunSummary[]> {
  if (!ids.length) return [];
  const runs = await em.find(Run, { where: { id: In(ids) }, relations: { session: { source: true }, createdBy: true } });
  const heads: Array<{ run_id: string; row_count: number; total_counts: number; headline_id: string | null }> = await em.query(
    `SELECT r.id AS run_id, rv.row_count, rv.total_counts, h.id AS headline_id
     FROM runs r ${HEADLINE_JOIN}
     WHERE r.id = ANY($1)`,
    [ids],
  );
  const headlineIds = heads.map((h) => h.headline_id).filter((x): x is string => !!x);
  const headlines = headlineIds.length ? await em.findBy(Reconstruction, { id: In(headlineIds) }) : [];
  const byId = new Map(runs.map((r) => [r.id, r]));
  const headOf = new Map(heads.map((h) => [h.run_id, h]));
  const recOf = new Map(headlines.map((h) => [h.id, h]));
  return ids.map((id) => {
    const h = headOf.get(id)!;
    return { run: byId.get(id)!, rowCount: h.row_count, totalCounts: h.total_counts, headline: h.headline_id ? recOf.get(h.headline_id)! : null };
  });
}

/** Users by id, with only what presenters show (id, name). */
async function peopleById(em: EntityManager, ids: Array<string | null>): Promise<Map<string, User>> {
  const wanted = [...new Set(ids.filter((x): x is string => !!x))];
  if (!wanted.length) return new Map();
  const rows: Array<{ id: string; display_name: string }> = await em.query("SELECT id, display_name FROM users WHERE id = ANY($1)", [wanted]);
  return new Map(rows.map((r) => [r.id, Object.assign(new User(), { id: r.id, displayName: r.display_name })]));
}

/**
 * Runs the queries side by side on the pool, or one after the other inside a transaction: a
 * transaction has a single connection, and overlapping queries on one pg client are deprecated
 * (pg 8 queues them and warns; pg 9 will refuse them).
 */
async function inParallelUnlessTransaction<T extends readonly (() => Promise<unknown>)[]>(em: EntityManager, queries: T): Promise<{ -readonly [K in keyof T]: Awaited<ReturnType<T[K]>> }> {
  type Results = { -readonly [K in keyof T]: Awaited<ReturnType<T[K]>> };
  if (!em.queryRunner) return (await Promise.all(queries.map((q) => q()))) as Results;
  const results: unknown[] = [];
  for (const q of queries) results.push(await q());
  return results as Results;
}

/** A run of this lab, or 404. */
export async function findRun(labId: string, runId: string, em: EntityManager = db().manager): Promise<Run> {
  const run = await em.findOne(Run, { where: { id: runId, labId }, relations: { session: { source: true }, createdBy: true } });
  if (!run) throw notFound("Run");
  return run;
}

/**
 * One run with everything its page shows. The summary (row count, total, headline) is taken from
 * the revisions and reconstructions loaded anyway — the same rule as HEADLINE_JOIN: the newest
 * maximum-likelihood reconstruction of the current revision — so a run page costs four queries.
 */
export async function loadRunDetail(labId: string, runId: string, em: EntityManager = db().manager): Promise<RunDetail> {
  const run = await findRun(labId, runId, em);
  const [revisions, reconstructions, attachments] = await inParallelUnlessTransaction(em, [
    () => em.find(RunRevision, { where: { runId }, order: { number: "ASC" } }),
    () => em.find(Reconstruction, { where: { runId }, order: { createdAt: "DESC", id: "DESC" } }),
    () => em.find(Attachment, { where: { runId }, order: { createdAt: "ASC" } }),
  ] as const);
  // The few people behind these rows, in one query, rather than a users join per table.
  const people = await peopleById(em, [...revisions, ...reconstructions, ...attachments].map((x) => x.createdById));
  for (const x of [...revisions, ...reconstructions, ...attachments]) x.createdBy = x.createdById ? (people.get(x.createdById) ?? null) : null;
  const current = revisions.find((r) => r.number === run.currentRevision);
  if (!current) throw new Error(`run ${runId} has no revision ${run.currentRevision}`);
  const headline = reconstructions.find((r) => r.revisionId === current.id && r.method === "mle") ?? null;
  return { run, rowCount: current.rowCount, totalCounts: current.totalCounts, headline, revisions, reconstructions, attachments };
}
