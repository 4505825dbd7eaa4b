import { describe, expect, it } from 'vitest';
import { asBytes, signedInTeam } from '../support/test-app';
import { approveAllCharts, roundupWithResults, setAllVerdicts, signOffWriteUp } from './support/editorial-fixtures';

/** Width and height from a PNG's IHDR chunk (PNG specification, ISO/IEC 15948: bytes 16–23, big-endian). */
function pngSize(png: Buffer) {
  return { width: png.readUInt32BE(16), height: png.readUInt32BE(20) };
}

describe('chart approval and readiness to schedule', () => {
  it('when a run of record changes after approval, then the chart is stale, says what changed and blocks scheduling until re-approved', async () => {
    const { editor, tester, writer } = await signedInTeam();
    // Two boards under one load; the first board's cell has a second run, kept aside.
    const { roundupId, products } = await roundupWithResults(editor.agent, tester, [
      [[{ peakC: 78.4 }, { peakC: 83.1 }]],
      [[{ peakC: 72.0 }]],
    ]);

    const before = await writer.agent.get(`/api/roundups/${roundupId}/readiness`);
    expect(before.status).toBe(200);
    expect(before.body.ready).toBe(false);
    const kinds = before.body.blocking.map((b: { kind: string }) => b.kind);
    expect(kinds).toContain('state');
    // The write-up's sections are not signed off yet, and say so through the same list.
    expect(kinds).toContain('section');
    // Each section's line opens that section.
    expect(before.body.blocking.find((b: { kind: string }) => b.kind === 'section').link).toMatch(
      new RegExp(`^/roundups/${roundupId}/write-up/\\d+$`),
    );
    // Neither board has its verdict label yet; each is named with a link to its verdict.
    expect(before.body.blocking.filter((b: { kind: string }) => b.kind === 'verdict')).toEqual(
      products.map((p) => expect.objectContaining({ link: `/roundups/${roundupId}/verdicts#verdict-${p.entryId}` })),
    );
    // One configuration chart, two product charts and the price scatter, none approved yet.
    expect(kinds.filter((k: string) => k === 'chart')).toHaveLength(4);
    expect(before.body.blocking.find((b: { kind: string }) => b.kind === 'chart').link).toMatch(
      new RegExp(`^/roundups/${roundupId}/charts#`),
    );

    // A writer may not approve a chart.
    const charts = await editor.agent.get(`/api/roundups/${roundupId}/charts`);
    const first = charts.body.charts[0];
    expect(first).toMatchObject({ kind: 'configuration', status: 'not-approved' });
    // Sorted best to worst: 72.0 °C before 78.4 °C (the fixture's manual peaks).
    expect(first.data.bars.map((b: { value: number }) => b.value)).toEqual([72, 78.4]);
    expect(first.data.bars.every((b: { marks: string[] }) => b.marks.includes('Manual entry'))).toBe(true);
    const refused = await writer.agent.post(`/api/roundups/${roundupId}/charts/${first.key}/approval`).send({});
    expect(refused.status).toBe(403);
    expect(refused.body.error.code).toBe('forbidden');

    // Approving what one did not see is refused.
    const wrongHash = await editor.agent
      .post(`/api/roundups/${roundupId}/charts/${first.key}/approval`)
      .send({ snapshotHash: '0'.repeat(64) });
    expect(wrongHash.status).toBe(409);
    expect(wrongHash.body.error.code).toBe('chart_changed');

    await setAllVerdicts(editor.agent, roundupId);
    await approveAllCharts(editor.agent, roundupId);
    await signOffWriteUp(editor.agent, roundupId);
    const sent = await writer.agent.post(`/api/roundups/${roundupId}/review-request`).send({});
    expect(sent.status, sent.text).toBe(200);
    expect(sent.body.state).toBe('in-review');
    const ready = await editor.agent.get(`/api/roundups/${roundupId}/readiness`);
    expect(ready.body).toMatchObject({ roundupId, ready: true, blocking: [], state: 'in-review' });

    // The approved image is stored and served: a PNG of 1200 × 630.
    const image = await asBytes(writer.agent.get(`/api/roundups/${roundupId}/charts/${first.key}/image.png`));
    expect(image.status).toBe(200);
    expect(image.headers['content-type']).toBe('image/png');
    expect(pngSize(image.body as Buffer)).toEqual({ width: 1200, height: 630 });

    // The editor makes the second run stand for the first board's cell.
    const swap = await editor.agent.post(`/api/runs/${products[0].runIds[0][1]}/run-of-record`).send({});
    expect(swap.status, swap.text).toBe(200);

    const after = await editor.agent.get(`/api/roundups/${roundupId}/charts`);
    const stale = after.body.charts.find((c: { key: string }) => c.key === first.key);
    expect(stale.status).toBe('stale');
    expect(stale.changes.join(' ')).toMatch(/another run of record/);
    expect(stale.changes.join(' ')).toMatch(/78\.4\u2009°C → 83\.1\u2009°C/);
    // The approved snapshot is kept as it was.
    expect(stale.approval.data.bars.map((b: { value: number }) => b.value)).toEqual([72, 78.4]);

    const blocked = await editor.agent.get(`/api/roundups/${roundupId}/readiness`);
    expect(blocked.body.ready).toBe(false);
    expect(blocked.body.blocking.map((b: { label: string }) => b.label).join(' ')).toMatch(
      /is stale and needs re-approval/,
    );
    // The product chart of that board and the scatter went stale too; the other board's chart did not.
    expect(blocked.body.blocking).toHaveLength(3);

    await approveAllCharts(editor.agent, roundupId);
    const again = await editor.agent.get(`/api/roundups/${roundupId}/readiness`);
    expect(again.body.ready).toBe(true);

    const history = await editor.agent.get(`/api/roundups/${roundupId}/history`);
    const approvals = history.body.entries.filter((e: { action: string }) => e.action === 'chart.approved');
    expect(approvals.length).toBe(7);
    expect(approvals[0].details.wasStale).toBe(true);
  });

  it('a chart’s settings are the editor’s: a writer cannot change them, and a new metric makes the approval stale', async () => {
    const { editor, tester, writer } = await signedInTeam();
    const { roundupId, loadConfigurationIds } = await roundupWithResults(editor.agent, tester, [[[{ peakC: 80.5 }]]]);
    await approveAllCharts(editor.agent, roundupId);
    const key = `configuration-${loadConfigurationIds[0]}`;
    const settings = { metric: 'delta', referenceEntryIds: null, loadConfigurationId: null };
    const denied = await writer.agent.put(`/api/roundups/${roundupId}/charts/${key}/settings`).send(settings);
    expect(denied.status).toBe(403);
    const changed = await editor.agent.put(`/api/roundups/${roundupId}/charts/${key}/settings`).send(settings);
    expect(changed.status, changed.text).toBe(200);
    const chart = changed.body.charts.find((c: { key: string }) => c.key === key);
    expect(chart.status).toBe('stale');
    expect(chart.changes[0]).toMatch(/metric changed to Rise over ambient/);
    // 80.5 °C peak over a 21.0 °C ambient (the manual entry): a 59.5 °C rise.
    expect(chart.data.bars[0].value).toBeCloseTo(59.5, 6);

    const misfit = await editor.agent
      .put(`/api/roundups/${roundupId}/charts/${key}/settings`)
      .send({ ...settings, loadConfigurationId: loadConfigurationIds[0] });
    expect(misfit.status).toBe(422);
    expect(misfit.body.error.fields.loadConfigurationId).toMatch(/Only the price scatter/);
    const unknown = await editor.agent.get(`/api/roundups/${roundupId}/charts/configuration-999999/image.png`);
    expect(unknown.status).toBe(404);
  });

  it('an editor leaves an open cell out with a reason and can take it back; readiness follows', async () => {
    const { editor, tester, writer } = await signedInTeam();
    const { roundupId, products } = await roundupWithResults(
      editor.agent,
      tester,
      [[[{ peakC: 70 }]], [[{ peakC: 75 }]]],
      { leaveOpen: true },
    );
    const openCell = products[1].cellIds[0];
    const before = await editor.agent.get(`/api/roundups/${roundupId}/readiness`);
    const cellBlockers = before.body.blocking.filter((b: { kind: string }) => b.kind === 'cell');
    expect(cellBlockers).toHaveLength(1);
    expect(cellBlockers[0].label).toMatch(/is Running: accept a run or leave the cell out with a reason/);
    expect(cellBlockers[0].link).toBe(`/roundups/${roundupId}?tab=matrix`);

    const noReason = await editor.agent
      .put(`/api/roundups/${roundupId}/cells/${openCell}/exclusion`)
      .send({ reason: '  ' });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.fields.reason).toBeTruthy();
    const byWriter = await writer.agent
      .put(`/api/roundups/${roundupId}/cells/${openCell}/exclusion`)
      .send({ reason: 'The sample died.' });
    expect(byWriter.status).toBe(403);

    const excluded = await editor.agent
      .put(`/api/roundups/${roundupId}/cells/${openCell}/exclusion`)
      .send({ reason: 'The sample’s power stage failed during the soak; the maker has no second sample.' });
    expect(excluded.status, excluded.text).toBe(200);
    expect(excluded.body.blocking.filter((b: { kind: string }) => b.kind === 'cell')).toEqual([]);

    const back = await editor.agent.delete(`/api/roundups/${roundupId}/cells/${openCell}/exclusion`);
    expect(back.status, back.text).toBe(200);
    expect(back.body.blocking.filter((b: { kind: string }) => b.kind === 'cell')).toHaveLength(1);
    const again = await editor.agent.delete(`/api/roundups/${roundupId}/cells/${openCell}/exclusion`);
    expect(again.status).toBe(404);

    const history = await editor.agent.get(`/api/roundups/${roundupId}/history`);
    const actions = history.body.entries.map((e: { action: string }) => e.action);
    expect(actions).toContain('matrix.cell_excluded');
    expect(actions).toContain('matrix.cell_included');
  });

  it('a tested product without a verdict label blocks readiness until the editor sets one; a product left out entirely needs none', async () => {
    const { editor, tester } = await signedInTeam();
    const { roundupId, products } = await roundupWithResults(
      editor.agent,
      tester,
      [[[{ peakC: 70 }]], [[{ peakC: 75 }]]],
      { leaveOpen: true },
    );
    const verdictBlockers = async () =>
      (await editor.agent.get(`/api/roundups/${roundupId}/readiness`)).body.blocking.filter(
        (b: { kind: string }) => b.kind === 'verdict',
      ) as { label: string; link: string }[];
    const before = await verdictBlockers();
    expect(before.map((b) => b.link)).toEqual(
      products.map((p) => `/roundups/${roundupId}/verdicts#verdict-${p.entryId}`),
    );
    expect(before[0].label).toMatch(/has no verdict label yet: choose one on the verdicts page\.$/);

    const set = await editor.agent.put(`/api/roundups/${roundupId}/verdicts/${products[0].entryId}`).send({
      label: 'bench-pick',
      bestFor: 'A quiet stock build',
      price: { amountMinor: 16000, currency: 'EUR' },
    });
    expect(set.status, set.text).toBe(200);
    expect((await verdictBlockers()).map((b) => b.link)).toEqual([
      `/roundups/${roundupId}/verdicts#verdict-${products[1].entryId}`,
    ]);

    // The second board's only cell is left out: it has no results to judge, so no label is asked for.
    const excluded = await editor.agent
      .put(`/api/roundups/${roundupId}/cells/${products[1].cellIds[0]}/exclusion`)
      .send({ reason: 'The sample’s power stage failed during the soak.' });
    expect(excluded.status, excluded.text).toBe(200);
    expect(await verdictBlockers()).toEqual([]);
  });

  it('only a roundup that is Writing goes to review, and a tester cannot send it', async () => {
    const { editor, tester } = await signedInTeam();
    const { roundupId } = await roundupWithResults(editor.agent, tester, [[[{ peakC: 70 }]]]);
    const byTester = await tester.agent.post(`/api/roundups/${roundupId}/review-request`).send({});
    expect(byTester.status).toBe(403);
    expect((await editor.agent.post(`/api/roundups/${roundupId}/review-request`).send({})).status).toBe(200);
    const twice = await editor.agent.post(`/api/roundups/${roundupId}/review-request`).send({});
    expect(twice.status).toBe(409);
    expect(twice.body.error.message).toMatch(/already in review/);
  });
});
