import { expect } from 'vitest';
import { WriteUpSectionEntity } from '../../../../server/entities/write-up-section.entity';
import { testDataSource, type Client } from '../../support/test-app';
import {
  addEntry,
  addPrice,
  createProduct,
  createRoundup,
  dayFromToday,
  matrixOf,
  moveToBench,
  tag,
} from '../../planning/support/planning-fixtures';

export interface ManualFigures {
  peakC: number;
  throttled?: boolean;
}

/** A manual run on a running cell (no booking, so with a reason). */
export async function manualRun(tester: Client, cellId: number, figures: ManualFigures) {
  const response = await tester.post(`/api/cells/${cellId}/manual-runs`).send({
    firmwareVersion: 'F1.0',
    startedAt: new Date().toISOString(),
    manualPeakC: figures.peakC,
    manualAmbientC: 21.0,
    throttled: figures.throttled ?? false,
    outsideBookingReason: 'Set-up check before the booking system was used.',
  });
  expect(response.status, response.text).toBe(201);
  return response.body.run.id as number;
}

export interface TestedProduct {
  entryId: number;
  productId: number;
  /** Runs per load configuration, in the plan's order; the first of each cell is its run of record. */
  runIds: number[][];
  cellIds: number[];
}

/**
 * A roundup in Writing whose every cell is accepted with a run of record: one tested product per row of `figures`,
 * each with one or more manual runs per load configuration (the first stands for the cell). Prices in DE, EUR.
 */
export async function roundupWithResults(
  editor: Client,
  tester: { agent: Client; user: { id: number } },
  figures: ManualFigures[][][],
  options: {
    leaveOpen?: boolean;
    /** Load configurations (and bench profile) to plan with, e.g. an earlier roundup's; default: new ones. */
    plan?: { benchProfileId: number; loadConfigurationIds: number[] };
    /** Products of earlier roundups to add as reference entries, before testing starts. */
    referenceProductIds?: number[];
  } = {},
) {
  const configurations = figures[0].length;
  const setup = options.plan
    ? await roundupOnPlan(editor, options.plan)
    : await createRoundup(editor, { configurations });
  const products: TestedProduct[] = [];
  for (const [index] of figures.entries()) {
    const productId = await createProduct(editor, setup.platform);
    await addPrice(editor, productId, {
      region: 'DE',
      currency: 'EUR',
      amountMinor: 16000 + index * 1500,
      observedOn: dayFromToday(-3),
    });
    const { entry } = await addEntry(editor, setup.roundupId, productId);
    products.push({ entryId: entry.id, productId, runIds: [], cellIds: [] });
  }
  for (const productId of options.referenceProductIds ?? []) {
    const reference = await editor
      .post(`/api/roundups/${setup.roundupId}/entries`)
      .send({ productId, kind: 'reference' });
    expect(reference.status, reference.text).toBe(201);
  }
  await moveToBench(editor, setup.roundupId);
  const assign = await editor
    .post(`/api/roundups/${setup.roundupId}/assignments`)
    .send({ entryIds: products.map((p) => p.entryId), testerId: tester.user.id, dueDate: dayFromToday(5) });
  expect(assign.status, assign.text).toBe(200);
  const matrix = await matrixOf(editor, setup.roundupId);
  for (const [index, product] of products.entries()) {
    const row = matrix.rows.find((r) => r.entryId === product.entryId)!;
    for (const [column, cell] of row.cells.entries()) {
      const start = await tester.agent
        .post(`/api/roundups/${setup.roundupId}/cells/${cell.id}/transitions`)
        .send({ action: 'start', overrideReason: 'Bench free this morning; booking follows' });
      expect(start.status, start.text).toBe(200);
      const runIds: number[] = [];
      for (const run of figures[index][column]) runIds.push(await manualRun(tester.agent, cell.id, run));
      product.runIds.push(runIds);
      product.cellIds.push(cell.id);
      if (options.leaveOpen && index === products.length - 1 && column === row.cells.length - 1) continue;
      const record = await tester.agent
        .post(`/api/roundups/${setup.roundupId}/cells/${cell.id}/transitions`)
        .send({ action: 'record' });
      expect(record.status, record.text).toBe(200);
      const accept = await editor
        .post(`/api/roundups/${setup.roundupId}/cells/${cell.id}/transitions`)
        .send({ action: 'accept' });
      expect(accept.status, accept.text).toBe(200);
      const ofRecord = await editor.post(`/api/runs/${runIds[0]}/run-of-record`).send({});
      expect(ofRecord.status, ofRecord.text).toBe(200);
    }
  }
  if (!options.leaveOpen) {
    const writing = await editor.post(`/api/roundups/${setup.roundupId}/state`).send({ to: 'writing' });
    expect(writing.status, writing.text).toBe(200);
  }
  return { ...setup, products };
}

/** A roundup on a given bench profile and load configurations (say, an earlier roundup's), in Planning. */
async function roundupOnPlan(editor: Client, plan: { benchProfileId: number; loadConfigurationIds: number[] }) {
  const platform = `Helix-1700 ${tag()}`;
  const response = await editor.post('/api/roundups').send({
    title: `Helix-1700 follow-up ${tag()}`,
    platform,
    priceBand: { minMinor: 15000, maxMinor: 22000, currency: 'EUR', region: 'DE' },
    targetPublishDate: dayFromToday(60),
    timeZone: 'Europe/Berlin',
    benchProfileId: plan.benchProfileId,
    loadConfigurationIds: plan.loadConfigurationIds,
  });
  expect(response.status, response.text).toBe(201);
  return { roundupId: response.body.id as number, platform, ...plan };
}

/** Approves every chart that has something to draw, as the editor saw it. */
export async function approveAllCharts(editor: Client, roundupId: number) {
  const list = await editor.get(`/api/roundups/${roundupId}/charts`);
  expect(list.status, list.text).toBe(200);
  for (const chart of list.body.charts as { key: string; status: string; snapshotHash: string }[]) {
    if (chart.status === 'empty' || chart.status === 'approved') continue;
    const approved = await editor
      .post(`/api/roundups/${roundupId}/charts/${chart.key}/approval`)
      .send({ snapshotHash: chart.snapshotHash });
    expect(approved.status, approved.text).toBe(200);
  }
}

/**
 * Signs off every write-up section of the roundup, so that readiness depends on the charts and cells alone. The
 * sections are created by the readiness check itself (the write-up opens at Writing).
 */
export async function signOffWriteUp(agent: Client, roundupId: number) {
  expect((await agent.get(`/api/roundups/${roundupId}/readiness`)).status).toBe(200);
  const ds = await testDataSource();
  await ds
    .getRepository(WriteUpSectionEntity)
    .update({ roundupId }, { reviewState: 'signed-off', reviewStateChangedAt: new Date() });
}

/**
 * Gives every tested product of the roundup a verdict label (with a reason, in case the label goes against the runs),
 * so that readiness does not wait for verdicts. Set before approving charts: the price at publication feeds the scatter.
 */
export async function setAllVerdicts(editor: Client, roundupId: number) {
  const list = await editor.get(`/api/roundups/${roundupId}/verdicts`);
  expect(list.status, list.text).toBe(200);
  for (const product of list.body.products as { entryId: number; verdict: unknown }[]) {
    if (product.verdict) continue;
    const set = await editor.put(`/api/roundups/${roundupId}/verdicts/${product.entryId}`).send({
      label: 'fine-at-stock',
      bestFor: 'Builds that stay at stock settings',
      price: { amountMinor: 17000, currency: 'EUR' },
      reason: 'Judged at stock only for this check.',
    });
    expect(set.status, set.text).toBe(200);
  }
}
