import { describe, expect, it } from 'vitest';
import { calendarDateIn } from '../../../shared/domain/planning/loan-overdue';
import { signedIn, testApp, type Client } from '../support/test-app';
import { addEntry, createProduct, createRoundup } from './support/planning-fixtures';

/** `date` moved by whole days. */
function shiftDate(date: string, days: number) {
  return new Date(Date.parse(`${date}T00:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);
}

async function loanedSample(editor: Client, timeZone: string, returnBy: string) {
  const { roundupId, platform } = await createRoundup(editor, { timeZone, configurations: 1 });
  const { entry } = await addEntry(editor, roundupId, await createProduct(editor, platform));
  const sampleId = entry.sample!.id;
  const response = await editor.patch(`/api/roundups/${roundupId}/samples/${sampleId}`).send({
    source: 'vendor-loan',
    vendorContact: 'Edda Vantongeren, press desk, Ostrel Works',
    returnBy,
    receivedOn: shiftDate(returnBy, -20),
    serialNumber: 'OW-4411-0097',
    firmwareOnArrival: '0812',
    conditionNotes: 'Box dented at one corner; board fine',
    status: 'received',
  });
  expect(response.status, response.text).toBe(200);
  return { roundupId, sampleId, sample: response.body };
}

describe('samples and loan returns', () => {
  it('a loan is overdue once its return-by date has ended in the roundup’s time zone', async () => {
    const app = await testApp();
    const { agent: editor } = await signedIn(app, 'editor');
    // The same return-by date, read in the zones furthest apart (UTC−12 and UTC+14, 26 hours apart, so their
    // local dates always differ): in UTC−12 it is still that date; in UTC+14 it has already ended.
    const today = calendarDateIn('Etc/GMT+12', new Date());
    const west = await loanedSample(editor, 'Etc/GMT+12', today);
    const east = await loanedSample(editor, 'Pacific/Kiritimati', today);
    expect(west.sample).toMatchObject({ overdue: false, daysOverdue: 0 });
    expect(east.sample.overdue).toBe(true);
    expect(east.sample.daysOverdue).toBeGreaterThanOrEqual(1);

    const roundup = await editor.get(`/api/roundups/${east.roundupId}`);
    expect(roundup.body.overdueSampleCount).toBe(1);
    expect(roundup.body.entries[0].sample.overdue).toBe(true);
    expect((await editor.get(`/api/roundups/${west.roundupId}`)).body.overdueSampleCount).toBe(0);

    const dashboard = await editor.get('/api/dashboard');
    expect(dashboard.body.view).toBe('editor');
    const overdueIds = dashboard.body.overdueSamples.map((s: { id: number }) => s.id);
    expect(overdueIds).toContain(east.sampleId);
    expect(overdueIds).not.toContain(west.sampleId);
    expect(dashboard.body.overdueSamples.find((s: { id: number }) => s.id === east.sampleId).roundupTitle).toEqual(
      roundup.body.title,
    );

    // Returned on time or not, a returned loan is no longer overdue.
    const returned = await editor
      .patch(`/api/roundups/${east.roundupId}/samples/${east.sampleId}`)
      .send({ status: 'returned', returnedOn: today });
    expect(returned.body).toMatchObject({ status: 'returned', overdue: false });
  });

  it('a sample record must be complete for its source and status', async () => {
    const app = await testApp();
    const { agent: editor } = await signedIn(app, 'editor');
    const { agent: tester } = await signedIn(app, 'tester');
    const { roundupId, platform } = await createRoundup(editor, { configurations: 1 });
    const { entry } = await addEntry(editor, roundupId, await createProduct(editor, platform));
    const url = `/api/roundups/${roundupId}/samples/${entry.sample!.id}`;

    const loanWithoutDate = await editor.patch(url).send({ source: 'vendor-loan', vendorContact: 'press desk' });
    expect(loanWithoutDate.status).toBe(422);
    expect(loanWithoutDate.body.error.fields.returnBy).toMatch(/return-by/);
    const receivedWithoutDate = await editor.patch(url).send({
      source: 'retail',
      orderReference: 'BM-20931',
      costMinor: 18990,
      costCurrency: 'EUR',
      status: 'received',
    });
    expect(receivedWithoutDate.status).toBe(422);
    expect(receivedWithoutDate.body.error.fields.receivedOn).toBeTruthy();

    // A tester records the arrival of a retail purchase.
    const bought = await tester.patch(url).send({
      source: 'retail',
      orderReference: 'BM-20931',
      costMinor: 18990,
      costCurrency: 'eur',
      receivedOn: '2025-06-03',
      serialNumber: 'KV-B50-7781',
      firmwareOnArrival: '1.04',
      status: 'received',
    });
    expect(bought.status, bought.text).toBe(200);
    expect(bought.body).toMatchObject({
      cost: { amountMinor: 18990, currency: 'EUR' },
      overdue: false,
      returnBy: null,
    });

    // Switching the source drops the other source's fields.
    const lent = await editor
      .patch(url)
      .send({ source: 'vendor-loan', vendorContact: 'press desk', returnBy: '2099-01-31' });
    expect(lent.body).toMatchObject({ source: 'vendor-loan', orderReference: null, cost: null });

    const history = await editor.get(`/api/roundups/${roundupId}/history`);
    expect(history.body.entries[0]).toMatchObject({ action: 'roundup.sample_updated' });
    expect(history.body.entries[0].details.changes.source).toEqual({ from: 'retail', to: 'vendor-loan' });
  });
});
