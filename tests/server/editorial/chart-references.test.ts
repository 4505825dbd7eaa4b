import { describe, expect, it } from 'vitest';
import { signedIn, testApp } from '../support/test-app';
import { createLoadConfiguration } from '../planning/support/planning-fixtures';
import { roundupWithResults } from './support/editorial-fixtures';

interface Bar {
  label: string;
  role: 'roundup' | 'reference';
  value: number;
  referenceRoundupTitle: string | null;
}
interface Chart {
  key: string;
  data: { bars: Bar[]; omitted: { label: string; reason: string }[] };
  referenceChoices: { entryId: number; productName: string; roundupTitle: string; measured: boolean }[];
}

describe('reference products on the charts, across two roundups in MariaDB', () => {
  it('a product of an earlier roundup shows on the chart of a load configuration it was measured under there, and only there', async () => {
    const app = await testApp();
    const editor = await signedIn(app, 'editor');
    const tester = await signedIn(app, 'tester');

    // The earlier roundup: two boards, each measured under two load configurations (manual peaks, invented).
    const earlier = await roundupWithResults(editor.agent, tester, [
      [[{ peakC: 78.0 }], [{ peakC: 88.0 }]],
      [[{ peakC: 80.0 }], [{ peakC: 90.0 }]],
    ]);
    const [shared, onlyEarlier] = earlier.loadConfigurationIds;
    const earlierTitle = (await editor.agent.get(`/api/roundups/${earlier.roundupId}`)).body.title as string;

    // The later roundup shares the first configuration and adds one of its own; the earlier first board is a reference.
    const ownConfiguration = await createLoadConfiguration(editor.agent);
    const later = await roundupWithResults(editor.agent, tester, [[[{ peakC: 72.0 }], [{ peakC: 75.0 }]]], {
      plan: { benchProfileId: earlier.benchProfileId, loadConfigurationIds: [shared, ownConfiguration] },
      referenceProductIds: [earlier.products[0].productId],
    });
    expect(onlyEarlier).not.toBe(ownConfiguration);

    const list = await editor.agent.get(`/api/roundups/${later.roundupId}/charts`);
    expect(list.status, list.text).toBe(200);
    const charts = list.body.charts as Chart[];
    const sharedChart = charts.find((c) => c.key === `configuration-${shared}`)!;
    const ownChart = charts.find((c) => c.key === `configuration-${ownConfiguration}`)!;

    // Under the shared configuration: the later board (72.0 °C) and the reference at its earlier run of record
    // (78.0 °C), sorted coolest first, the reference named with the roundup it comes from.
    expect(sharedChart.data.bars.map((b) => [b.role, b.value])).toEqual([
      ['roundup', 72],
      ['reference', 78],
    ]);
    expect(sharedChart.data.bars[1].referenceRoundupTitle).toBe(earlierTitle);
    expect(sharedChart.referenceChoices).toEqual([
      expect.objectContaining({ roundupTitle: earlierTitle, measured: true }),
    ]);
    // The earlier roundup's other board is not a reference of this one, and the other configuration is not drawn.
    expect(sharedChart.data.bars.some((b) => b.value === 80 || b.value === 88)).toBe(false);

    // Under the later roundup's own configuration the reference was never measured: no bar, and the choice says so.
    expect(ownChart.data.bars.map((b) => b.role)).toEqual(['roundup']);
    expect(ownChart.referenceChoices).toEqual([expect.objectContaining({ measured: false })]);
    expect(charts.some((c) => c.key === `configuration-${onlyEarlier}`)).toBe(false);

    // The editor takes the reference off the shared chart, and cannot put a tested board in as a reference.
    const referenceEntryId = sharedChart.referenceChoices[0].entryId;
    const settings = { metric: 'peak', referenceEntryIds: [] as number[], loadConfigurationId: null };
    const without = await editor.agent
      .put(`/api/roundups/${later.roundupId}/charts/configuration-${shared}/settings`)
      .send(settings);
    expect(without.status, without.text).toBe(200);
    const bare = (without.body.charts as Chart[]).find((c) => c.key === `configuration-${shared}`)!;
    expect(bare.data.bars.map((b) => b.role)).toEqual(['roundup']);

    const misfit = await editor.agent
      .put(`/api/roundups/${later.roundupId}/charts/configuration-${shared}/settings`)
      .send({ ...settings, referenceEntryIds: [later.products[0].entryId] });
    expect(misfit.status).toBe(422);
    expect(misfit.body.error.fields['referenceEntryIds.0']).toBe('Not a reference product of this roundup.');

    const back = await editor.agent
      .put(`/api/roundups/${later.roundupId}/charts/configuration-${shared}/settings`)
      .send({ ...settings, referenceEntryIds: [referenceEntryId] });
    expect(back.status, back.text).toBe(200);
    const withReference = (back.body.charts as Chart[]).find((c) => c.key === `configuration-${shared}`)!;
    expect(withReference.data.bars.map((b) => b.value)).toEqual([72, 78]);
  });
});
