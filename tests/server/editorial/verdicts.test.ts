import { describe, expect, it } from 'vitest';
import { signedIn, signedInTeam, testApp } from '../support/test-app';
import { roundupWithResults } from './support/editorial-fixtures';

describe('editorial verdicts', () => {
  it('a label that contradicts the runs of record needs a written reason; the evidence is shown beside it', async () => {
    const { editor, tester, writer } = await signedInTeam();
    const { roundupId, products } = await roundupWithResults(editor.agent, tester, [
      [[{ peakC: 74.0 }]],
      [[{ peakC: 69.0, throttled: true }]],
    ]);
    const [cool, throttled] = products;

    const list = await writer.agent.get(`/api/roundups/${roundupId}/verdicts`);
    expect(list.status).toBe(200);
    const evidence = list.body.products.find((p: { entryId: number }) => p.entryId === throttled.entryId).evidence;
    expect(evidence).toEqual([
      expect.objectContaining({ verdictCode: 'throttled', throttled: true, hasRunOfRecord: true, peakC: 69 }),
    ]);
    expect(list.body.products[0].catalogPrice).toEqual({ amountMinor: 16000, currency: 'EUR' });

    const body = {
      label: 'recommended',
      bestFor: 'A quiet stock build',
      price: { amountMinor: 17999, currency: 'EUR' },
    };
    const noReason = await editor.agent.put(`/api/roundups/${roundupId}/verdicts/${throttled.entryId}`).send(body);
    expect(noReason.status).toBe(422);
    expect(noReason.body.error.code).toBe('reason_required');
    expect(noReason.body.error.fields.reason).toMatch(/throttled/);

    const withReason = await editor.agent.put(`/api/roundups/${roundupId}/verdicts/${throttled.entryId}`).send({
      ...body,
      reason: 'It throttles only at the stress load nobody runs daily; at its price nothing else comes close.',
    });
    expect(withReason.status, withReason.text).toBe(200);
    const saved = withReason.body.products.find((p: { entryId: number }) => p.entryId === throttled.entryId);
    expect(saved.verdict).toMatchObject({ label: 'recommended', price: { amountMinor: 17999, currency: 'EUR' } });
    expect(saved.contradictions).toHaveLength(1);

    // Agreeing with the evidence needs no reason; a writer may not set verdicts.
    const plain = await editor.agent.put(`/api/roundups/${roundupId}/verdicts/${cool.entryId}`).send({
      label: 'bench-pick',
      bestFor: 'Overclockers on a budget',
      price: { amountMinor: 18999, currency: 'EUR' },
    });
    expect(plain.status, plain.text).toBe(200);
    const byWriter = await writer.agent.put(`/api/roundups/${roundupId}/verdicts/${cool.entryId}`).send(body);
    expect(byWriter.status).toBe(403);

    // The price at publication feeds the price scatter.
    const charts = await editor.agent.get(`/api/roundups/${roundupId}/charts`);
    const scatter = charts.body.charts.find((c: { key: string }) => c.key === 'price-scatter');
    expect(
      scatter.data.points.map((p: { priceMinor: number; priceSource: string }) => [p.priceMinor, p.priceSource]),
    ).toEqual([
      [17999, 'verdict'],
      [18999, 'verdict'],
    ]);

    const history = await editor.agent.get(`/api/roundups/${roundupId}/history`);
    const set = history.body.entries.find(
      (e: { action: string; details: { entryId: number } }) =>
        e.action === 'verdict.set' && e.details.entryId === throttled.entryId,
    );
    expect(set.details.contradictions).toHaveLength(1);
  });

  it('a reference product or another roundup’s product gets no verdict here', async () => {
    const app = await testApp();
    const editor = await signedIn(app, 'editor');
    const tester = await signedIn(app, 'tester');
    const { roundupId } = await roundupWithResults(editor.agent, tester, [[[{ peakC: 74.0 }]]]);
    const other = await editor.agent
      .put(`/api/roundups/${roundupId}/verdicts/999999`)
      .send({ label: 'bench-pick', bestFor: 'Anyone', price: { amountMinor: 100, currency: 'EUR' } });
    expect(other.status).toBe(404);
    const badLabel = await editor.agent
      .put(`/api/roundups/${roundupId}/verdicts/999999`)
      .send({ label: 'editors-choice', bestFor: 'Anyone', price: { amountMinor: 100, currency: 'EUR' } });
    expect(badLabel.status).toBe(400);
    expect(badLabel.body.error.fields.label).toBe('Choose a label from the list.');
  });
});
