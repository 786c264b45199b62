import type { EntityManager } from "typeorm";
import type { CreateSource, SourceListQuery, UpdateSource } from "@shared/schemas/sources";
import { db } from "../db/dataSource";
import { LabSession } from "../entities/LabSession";
import { Source } from "../entities/Source";
import type { AuthUser } from "../http/auth";
import { conflict, notFound } from "../http/errors";
import { fieldChanges, recordAudit } from "./audit";
import { containsPattern, pageWindow } from "./listing";

export interface SourceWithCount {
  source: Source;
  sessionCount: number;
}

/** A source of this lab, or 404 (also for a source of another lab). */
export async function findSource(labId: string, sourceId: string, em: EntityManager = db().manager): Promise<Source> {
  const source = await em.findOne(Source, { where: { id: sourceId, labId }, relations: { createdBy: true } });
  if (!source) throw notFound("Source");
  return source;
}

export async function getSource(labId: string, sourceId: string): Promise<SourceWithCount> {
  const source = await findSource(labId, sourceId);
  return { source, sessionCount: await db().manager.countBy(LabSession, { sourceId }) };
}

const SORT_COLUMN: Record<SourceListQuery["sort"], string> = { name: "lower(s.name)", createdAt: "s.created_at", updatedAt: "s.updated_at" };

export async function listSources(labId: string, query: SourceListQuery): Promise<{ items: SourceWithCount[]; total: number }> {
  const qb = db()
    .getRepository(Source)
    .createQueryBuilder("s")
    .leftJoinAndSelect("s.createdBy", "createdBy")
    .where("s.lab_id = :labId", { labId });
  if (query.q) {
    qb.andWhere("(s.name ILIKE :q OR s.crystal ILIKE :q OR s.pump_laser ILIKE :q OR s.notes ILIKE :q)", { q: containsPattern(query.q) });
  }
  const { take, skip } = pageWindow(query.page, query.pageSize);
  qb.orderBy(SORT_COLUMN[query.sort], query.order === "asc" ? "ASC" : "DESC").addOrderBy("s.id", "ASC").limit(take).offset(skip);
  const [sources, total] = await qb.getManyAndCount();
  const counts = await sessionCounts(sources.map((s) => s.id));
  return { items: sources.map((source) => ({ source, sessionCount: counts.get(source.id) ?? 0 })), total };
}

async function sessionCounts(sourceIds: string[]): Promise<Map<string, number>> {
  if (!sourceIds.length) return new Map();
  const rows: Array<{ source_id: string; n: string }> = await db().query(
    `SELECT source_id, count(*) AS n FROM lab_sessions WHERE source_id = ANY($1) GROUP BY source_id`,
    [sourceIds],
  );
  return new Map(rows.map((r) => [r.source_id, Number(r.n)]));
}

export async function createSource(user: AuthUser, labId: string, input: CreateSource): Promise<SourceWithCount> {
  return db().transaction(async (em) => {
    await assertNameFree(em, labId, input.name);
    const { id } = await em.save(em.create(Source, { ...input, labId, createdById: user.id }));
    await recordAudit(em, user, { labId, action: "source.create", entityType: "source", entityId: id, changes: { name: input.name } });
    return { source: await findSource(labId, id, em), sessionCount: 0 };
  });
}

export async function updateSource(user: AuthUser, labId: string, sourceId: string, patch: UpdateSource): Promise<SourceWithCount> {
  return db().transaction(async (em) => {
    const source = await findSource(labId, sourceId, em);
    if (patch.name && patch.name.toLowerCase() !== source.name.toLowerCase()) await assertNameFree(em, labId, patch.name);
    const changes = fieldChanges(source, patch);
    if (Object.keys(changes).length) {
      await em.update(Source, { id: sourceId, labId }, patch);
      await recordAudit(em, user, { labId, action: "source.update", entityType: "source", entityId: sourceId, changes });
    }
    return { source: await findSource(labId, sourceId, em), sessionCount: await em.countBy(LabSession, { sourceId }) };
  });
}

async function assertNameFree(em: EntityManager, labId: string, name: string): Promise<void> {
  const taken = await em.createQueryBuilder(Source, "s").where("s.lab_id = :labId AND lower(s.name) = lower(:name)", { labId, name }).getExists();
  if (taken) throw conflict(`This lab already has a source named “${name}”.`, [{ field: "name", message: "A source with this name exists in this lab." }]);
}
