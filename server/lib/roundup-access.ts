import type { EntityManager } from 'typeorm';
import { RoundupEntity } from '../entities/roundup.entity';
import { AppError, notFound } from '../errors';
import { planEditableStates, roundupStateLabels } from '../../shared/domain/planning/roundup-states';

/** Loads a roundup, or answers 404 when there is none with this id. */
export async function findRoundup(manager: EntityManager, id: number): Promise<RoundupEntity> {
  const roundup = await manager.getRepository(RoundupEntity).findOneBy({ id });
  if (!roundup) throw notFound('That roundup');
  return roundup;
}

/** Answers 404 when there is no roundup with this id. */
export async function assertRoundupExists(manager: EntityManager, id: number): Promise<void> {
  if (!(await manager.getRepository(RoundupEntity).existsBy({ id }))) throw notFound('That roundup');
}

/**
 * Loads a roundup inside a transaction with its row locked, so plan changes to one roundup queue up. A shared
 * (read) lock lets cell moves run side by side while keeping the roundup's state still under them.
 */
export async function lockRoundup(
  manager: EntityManager,
  id: number,
  mode: 'pessimistic_write' | 'pessimistic_read' = 'pessimistic_write',
): Promise<RoundupEntity> {
  const roundup = await manager.getRepository(RoundupEntity).findOne({ where: { id }, lock: { mode } });
  if (!roundup) throw notFound('That roundup');
  return roundup;
}

/** Refuses plan changes once the roundup has left Planning and On the bench. */
export function assertPlanEditable(roundup: RoundupEntity) {
  if (!planEditableStates.includes(roundup.state)) {
    throw new AppError(
      'plan_locked',
      422,
      `The roundup is ${roundupStateLabels[roundup.state]}: its test plan can change only while it is Planning or On the bench.`,
    );
  }
}
