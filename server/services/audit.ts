import type { EntityManager } from "typeorm";
import { AuditEntry } from "../entities/AuditEntry";
import type { AuthUser } from "../http/auth";

export interface AuditInput {
  labId: string;
  action: string;
  entityType: string;
  entityId: string;
  changes?: Record<string, unknown>;
}

/** Records one write; call it inside the write's own transaction so both stand or fall together. */
export async function recordAudit(em: EntityManager, actor: AuthUser | null, input: AuditInput): Promise<void> {
  await em.save(em.create(AuditEntry, { ...input, changes: input.changes ?? {}, actorId: actor?.id ?? null }));
}

/** `{ field: { from, to } }` for the fields of `patch` whose value differs from `before`. */
export function fieldChanges<T extends object>(before: T, patch: Partial<T>): Record<string, { from: unknown; to: unknown }> {
  const out: Record<string, { from: unknown; to: unknown }> = {};
  for (const [key, to] of Object.entries(patch)) {
    const from = (before as Record<string, unknown>)[key];
    if (JSON.stringify(from) !== JSON.stringify(to)) out[key] = { from, to };
  }
  return out;
}
