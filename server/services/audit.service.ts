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
