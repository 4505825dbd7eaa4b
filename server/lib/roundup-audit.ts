import { In, type EntityManager, type FindOptionsWhere } from 'typeorm';
import { RoundupEntity } from '../entities/roundup.entity';
import { recordAction } from '../services/audit.service';
import { planEditableStates } from '../../shared/domain/planning/roundup-states';
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
  return recordAction(manager, actor, action, ['roundup', roundupId], details);
}

/**
 * Records a change to something roundups share (a bench profile, a load configuration) in the history of every
 * roundup that uses it and is still in planning or on the bench: their plans changed with it.
 */
export async function recordSharedPlanChange(
  manager: EntityManager,
  actor: CurrentUser,
  usedBy: FindOptionsWhere<RoundupEntity>,
  action: string,
  details: Record<string, unknown>,
): Promise<void> {
  const affected = await manager.getRepository(RoundupEntity).find({
    where: { ...usedBy, state: In([...planEditableStates]) },
    select: { id: true },
  });
  for (const roundup of affected) await recordPlanChange(manager, actor, roundup.id, action, details);
}
