import type { EntityManager } from 'typeorm';
import { recordAudit } from '../services/audit.service';
import type { CurrentUser } from '../../shared/schemas/auth';

/**
 * Records a change to a roundup's plan in the audit log, inside the caller's transaction. Every plan change
 * (header, band, profile, configurations, entries, assignments, cell moves, samples) goes through here, so
 * the roundup's history reads from one subject.
 */
export function recordPlanChange(
  manager: EntityManager,
  actor: CurrentUser,
  roundupId: number,
  action: string,
  details: Record<string, unknown>,
): Promise<void> {
  return recordAudit(manager, { actorId: actor.id, action, subjectType: 'roundup', subjectId: roundupId, details });
}
