import type { EntityManager } from "typeorm";
import type { CreateLabSession, LabSessionListQuery, UpdateLabSession } from "@shared/schemas/labSessions";
import { db } from "../db/dataSource";
import { LabSession } from "../entities/LabSession";
import { Run } from "../entities/Run";
import type { AuthUser } from "../http/auth";
import { invalid, notFound } from "../http/errors";
import { fieldChanges, recordAudit } from "./audit";
import { containsPattern, pageWindow } from "./listing";
import { findSource } from "./sources";

export interface LabSessionWithCount {
  labSession: LabSession;
  runCount: number;
}

/** A session of this lab with its source and author, or 404. */
export async function findLabSession(labId: string, sessionId: string, em: EntityManager = db().manager): Promise<LabSession> {
  const s = await em.findOne(LabSession, { where: { id: sessionId, labId }, relations: { source: true, createdBy: true } });
  if (!s) throw notFound("Session");
  return s;
}

export async function getLabSession(labId: string, sessionId: string): Promise<LabSessionWithCount> {
  const labSession = await findLabSession(labId, sessionId);
  return { labSession, runCount: await db().manager.countBy(Run, { sessionId }) };
}

const SORT_COLUMN: Record<LabSessionListQuery["sort"], string> = {
  date: "ls.session_date",
  title: "lower(ls.title)",
  createdAt: "ls.created_at",
  pumpPowerMw: "ls.pump_power_mw",
};

export async function listLabSessions(labId: string, query: LabSessionListQuery): Promise<{ items: LabSessionWithCount[]; total: number }> {
  const qb = db()
    .getRepository(LabSession)
    .createQueryBuilder("ls")
    .leftJoinAndSelect("ls.source", "source")
    .leftJoinAndSelect("ls.createdBy", "createdBy")
    .where("ls.lab_id = :labId", { labId });
  if (query.sourceId) qb.andWhere("ls.source_id = :sourceId", { sourceId: query.sourceId });
  if (query.from) qb.andWhere("ls.session_date >= :from", { from: query.from });
  if (query.to) qb.andWhere("ls.session_date <= :to", { to: query.to });
  if (query.q) {
    qb.andWhere("(ls.title ILIKE :q OR ls.notes ILIKE :q OR ls.detectors ILIKE :q OR ls.people::text ILIKE :q OR source.name ILIKE :q)", { q: containsPattern(query.q) });
  }
  const { take, skip } = pageWindow(query.page, query.pageSize);
  const dir = query.order === "asc" ? "ASC" : "DESC";
  qb.orderBy(SORT_COLUMN[query.sort], dir, dir === "ASC" ? "NULLS FIRST" : "NULLS LAST").addOrderBy("ls.created_at", dir).addOrderBy("ls.id", "ASC").limit(take).offset(skip);
  const [sessions, total] = await qb.getManyAndCount();
  const counts = await runCounts(sessions.map((s) => s.id));
  return { items: sessions.map((labSession) => ({ labSession, runCount: counts.get(labSession.id) ?? 0 })), total };
}

export async function runCounts(sessionIds: string[]): Promise<Map<string, number>> {
  if (!sessionIds.length) return new Map();
  const rows: Array<{ session_id: string; n: string }> = await db().query(`SELECT session_id, count(*) AS n FROM runs WHERE session_id = ANY($1) GROUP BY session_id`, [sessionIds]);
  return new Map(rows.map((r) => [r.session_id, Number(r.n)]));
}

export async function createLabSession(user: AuthUser, labId: string, input: CreateLabSession): Promise<LabSessionWithCount> {
  return db().transaction(async (em) => {
    await findSource(labId, input.sourceId, em).catch(() => {
      throw notFoundField("sourceId");
    });
    const { id } = await em.save(em.create(LabSession, { ...input, labId, createdById: user.id }));
    await recordAudit(em, user, { labId, action: "labSession.create", entityType: "labSession", entityId: id, changes: { title: input.title, date: input.date } });
    return { labSession: await findLabSession(labId, id, em), runCount: 0 };
  });
}

/** Editing the setup never touches stored runs: each reconstruction keeps the conventions it used. */
export async function updateLabSession(user: AuthUser, labId: string, sessionId: string, patch: UpdateLabSession): Promise<LabSessionWithCount> {
  return db().transaction(async (em) => {
    const current = await findLabSession(labId, sessionId, em);
    if (patch.sourceId && patch.sourceId !== current.sourceId) {
      await findSource(labId, patch.sourceId, em).catch(() => {
        throw notFoundField("sourceId");
      });
    }
    const changes = fieldChanges(current, patch);
    if (Object.keys(changes).length) {
      await em.update(LabSession, { id: sessionId, labId }, patch);
      await recordAudit(em, user, { labId, action: "labSession.update", entityType: "labSession", entityId: sessionId, changes });
    }
    return { labSession: await findLabSession(labId, sessionId, em), runCount: await em.countBy(Run, { sessionId }) };
  });
}

function notFoundField(field: string) {
  return invalid(field, "No such source in this lab.");
}
