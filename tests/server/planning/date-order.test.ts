import { describe, expect, it } from 'vitest';
import { calendarDateIn } from '../../../shared/domain/planning/loan-overdue';
import { signedIn, testApp } from '../support/test-app';
import { addEntry, createProduct, createRoundup } from './support/planning-fixtures';

/** `date` moved by whole days. */
function shiftDate(date: string, days: number) {
  return new Date(Date.parse(`${date}T00:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);
}

describe('dates that belong together keep their order', () => {
  it('a vendor loan cannot have to be back before it arrived, whether sent together or one after the other', async () => {
    const app = await testApp();
    const { agent: editor } = await signedIn(app, 'editor');
    const { roundupId, platform } = await createRoundup(editor, { configurations: 1 });
    const { entry } = await addEntry(editor, roundupId, await createProduct(editor, platform));
    const url = `/api/roundups/${roundupId}/samples/${entry.sample!.id}`;

    const together = await editor.patch(url).send({
      source: 'vendor-loan',
      vendorContact: 'Press desk, Ostrel Works',
      receivedOn: '2026-03-10',
      returnBy: '2026-03-07',
      status: 'received',
    });
    expect(together.status).toBe(400);
    expect(together.body.error.fields.returnBy).toMatch(/before the day it arrived/);

    const saved = await editor.patch(url).send({
      source: 'vendor-loan',
      vendorContact: 'Press desk, Ostrel Works',
      receivedOn: '2026-03-10',
      returnBy: '2026-04-10',
      status: 'received',
    });
    expect(saved.status, saved.text).toBe(200);
    // Only the return-by date is sent now: the stored received date still counts.
    const later = await editor.patch(url).send({ returnBy: '2026-03-09' });
    expect(later.status).toBe(422);
    expect(later.body.error.fields.returnBy).toMatch(/before the day it arrived/);
    const moved = await editor.patch(url).send({ receivedOn: '2026-04-11' });
    expect(moved.status).toBe(422);
    expect(moved.body.error.fields.returnBy).toMatch(/before the day it arrived/);
    expect((await editor.get(`/api/roundups/${roundupId}/samples`)).body.samples[0].returnBy).toBe('2026-04-10');
  });

  it('a new roundup cannot target a publish date that has already passed in its time zone', async () => {
    const app = await testApp();
    const { agent: editor } = await signedIn(app, 'editor');
    const body = {
      title: 'Boards for the new platform',
      platform: 'Helix-1700',
      priceBand: { minMinor: 10000, maxMinor: 30000, currency: 'EUR', region: 'DE' },
      timeZone: 'Europe/Berlin',
    };
    const today = calendarDateIn('Europe/Berlin', new Date());
    const past = await editor.post('/api/roundups').send({ ...body, targetPublishDate: shiftDate(today, -1) });
    expect(past.status).toBe(400);
    expect(past.body.error.fields.targetPublishDate).toMatch(/has passed/);
    const onTime = await editor.post('/api/roundups').send({ ...body, targetPublishDate: today });
    expect(onTime.status, onTime.text).toBe(201);
  });

  it('a booking cannot end before it starts', async () => {
    const app = await testApp();
    const { agent: tester } = await signedIn(app, 'tester');
    const response = await tester
      .post('/api/benches/1/bookings')
      .send({ startsAt: '2026-06-02T12:00:00Z', endsAt: '2026-06-02T09:00:00Z', cellIds: [1] });
    expect(response.status).toBe(400);
    expect(response.body.error.fields.endsAt).toMatch(/end after it starts/);
  });
});
