import type { DataSource } from 'typeorm';
import { expect } from 'vitest';
import { RoundupEntity } from '../../../../server/entities/roundup.entity';
import { instantToZonedTime } from '../../../../shared/domain/publishing/zoned-time';
import type { Client } from '../../support/test-app';
import { addEntry, createProduct, createRoundup } from '../../planning/support/planning-fixtures';

/**
 * A roundup with two tested boards, put In review directly: the writing and review steps belong to the editorial
 * work, and publishing starts where they end.
 */
export async function roundupInReview(editor: Client, dataSource: DataSource) {
  const setup = await createRoundup(editor, { configurations: 1 });
  const productIds = [await createProduct(editor, setup.platform), await createProduct(editor, setup.platform)];
  for (const productId of productIds) await addEntry(editor, setup.roundupId, productId);
  await dataSource
    .getRepository(RoundupEntity)
    .update({ id: setup.roundupId }, { state: 'in-review', stateChangedAt: new Date() });
  const title = (await dataSource.getRepository(RoundupEntity).findOneByOrFail({ id: setup.roundupId })).title;
  return { ...setup, productIds, title };
}

/** The local date and time of an instant in a zone, as the schedule form sends them (seconds included). */
export function localScheduleFor(instant: Date, timeZone: string) {
  const local = instantToZonedTime(instant, timeZone);
  const time = local.time.length === 5 ? `${local.time}:00` : local.time;
  return { date: local.date, time, timeZone };
}

export async function scheduleAt(editor: Client, roundupId: number, instant: Date, timeZone = 'Europe/Berlin') {
  const response = await editor.put(`/api/roundups/${roundupId}/schedule`).send(localScheduleFor(instant, timeZone));
  expect(response.status, response.text).toBe(200);
  return response.body as { state: string; schedule: { publishAt: string } };
}
