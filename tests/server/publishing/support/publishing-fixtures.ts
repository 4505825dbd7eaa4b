import type { DataSource } from 'typeorm';
import { expect } from 'vitest';
import { RoundupEntity } from '../../../../server/entities/roundup.entity';
import { instantToZonedTime } from '../../../../shared/domain/publishing/zoned-time';
import { createApp } from '../../../../server/app';
import { createServices } from '../../../../server/compose-services';
import { signedIn, testDataSource, testEnv, type Client, type TestApp } from '../../support/test-app';
import { approveAllCharts, roundupWithResults, signOffWriteUp } from '../../editorial/support/editorial-fixtures';

/**
 * A roundup genuinely ready to schedule, reached through the app as staff reach it: two tested boards under one load,
 * each cell accepted with a run of record, a verdict per board, every chart approved, sent to review, and every
 * write-up section signed off. Readiness reports nothing left to do.
 */
/** The test database, the services over it and an app sharing those services (so a test can drive the job runner). */
export async function publishingContext() {
  const dataSource = await testDataSource();
  const services = createServices(dataSource, testEnv());
  return { dataSource, services, app: createApp({ dataSource, env: testEnv(), services }) };
}

export async function roundupInReview(app: TestApp, editor: Client, dataSource: DataSource) {
  const tester = await signedIn(app, 'tester');
  const setup = await roundupWithResults(editor, tester, [[[{ peakC: 68.4 }]], [[{ peakC: 73.9 }]]]);
  const verdicts = await editor.get(`/api/roundups/${setup.roundupId}/verdicts`);
  expect(verdicts.status, verdicts.text).toBe(200);
  for (const product of verdicts.body.products as {
    entryId: number;
    catalogPrice: { amountMinor: number; currency: string } | null;
  }[]) {
    const set = await editor.put(`/api/roundups/${setup.roundupId}/verdicts/${product.entryId}`).send({
      label: 'fine-at-stock',
      bestFor: 'Stock builds that never raise the limits',
      price: product.catalogPrice ?? { amountMinor: 16000, currency: 'EUR' },
      reason: 'Both boards held their stock limits without throttling.',
    });
    expect(set.status, set.text).toBe(200);
  }
  await approveAllCharts(editor, setup.roundupId);
  const review = await editor.post(`/api/roundups/${setup.roundupId}/review-request`).send({});
  expect(review.status, review.text).toBe(200);
  await signOffWriteUp(editor, setup.roundupId);
  const readiness = await editor.get(`/api/roundups/${setup.roundupId}/readiness`);
  expect(readiness.body.blocking, readiness.text).toEqual([]);
  const title = (await dataSource.getRepository(RoundupEntity).findOneByOrFail({ id: setup.roundupId })).title;
  return { ...setup, productIds: setup.products.map((p) => p.productId), title };
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
