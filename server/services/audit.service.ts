import type { EntityManager } from 'typeorm';
import { AuditEntryEntity } from '../entities/audit-entry.entity';

export interface AuditInput {
  actorId: number | null;
  action: string;
  subjectType: string;
  subjectId?: string | number | null;
  details?: Record<string, unknown> | null;
}

/** Records an audit entry inside the caller's transaction, so the entry and the change land together. */
export async function recordAudit(manager: EntityManager, input: AuditInput): Promise<void> {
  const entry = manager.getRepository(AuditEntryEntity).create({
    actorId: input.actorId,
    action: input.action,
    subjectType: input.subjectType,
    subjectId: input.subjectId == null ? null : String(input.subjectId),
    details: input.details ?? null,
  });
  await manager.getRepository(AuditEntryEntity).save(entry);
}

/** What an audit entry is about: the kind of record and which one (`['product', 12]`, `['catalog', null]`). */
export type AuditSubject = readonly [subjectType: string, subjectId: string | number | null];

/**
 * Records that a person did `action` to one subject, the form nearly every audited change takes. `actor` is null
 * for what the system does by itself (a scheduled publication, sections a new roundup starts with).
 */
export function recordAction(
  manager: EntityManager,
  actor: { id: number } | null,
  action: string,
  [subjectType, subjectId]: AuditSubject,
  details?: Record<string, unknown>,
): Promise<void> {
  return recordAudit(manager, { actorId: actor?.id ?? null, action, subjectType, subjectId, details });
}
