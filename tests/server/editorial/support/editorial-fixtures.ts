import { expect } from 'vitest';
import { WriteUpSectionEntity } from '../../../../server/entities/write-up-section.entity';
import { testDataSource, type Client } from '../../support/test-app';
import {
  addTestedBoards,
  assignCells,
  createRoundup,
  dayFromToday,
  matrixOf,
  moveCell,
  moveRoundup,
  moveToBench,
  recordManualRun,
  pricedProduct,
  type ManualFigures,
} from '../../planning/support/planning-fixtures';

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
  const setup = await createRoundup(editor, { configurations, plan: options.plan });
  const boards = await addTestedBoards(editor, setup, figures.length, (index) =>
    pricedProduct(editor, setup.platform, [{ amountMinor: 16000 + index * 1500, observedOn: dayFromToday(-3) }]),
  );
  const products: TestedProduct[] = boards.map((board) => ({ ...board, runIds: [], cellIds: [] }));
  for (const productId of options.referenceProductIds ?? []) {
    const reference = await editor
      .post(`/api/roundups/${setup.roundupId}/entries`)
      .send({ productId, kind: 'reference' });
    expect(reference.status, reference.text).toBe(201);
  }
  await moveToBench(editor, setup.roundupId);
  const entryIds = products.map((p) => p.entryId);
  await assignCells(editor, setup.roundupId, { entryIds }, tester.user.id, dayFromToday(5));
  const matrix = await matrixOf(editor, setup.roundupId);
  for (const [index, product] of products.entries()) {
    const row = matrix.rows.find((r) => r.entryId === product.entryId)!;
    for (const [column, cell] of row.cells.entries()) {
      await moveCell(tester.agent, setup.roundupId, cell.id, 'start');
      const runIds: number[] = [];
      for (const run of figures[index][column]) runIds.push((await recordManualRun(tester.agent, cell.id, run)).id);
      product.runIds.push(runIds);
      product.cellIds.push(cell.id);
      if (options.leaveOpen && index === products.length - 1 && column === row.cells.length - 1) continue;
      await moveCell(tester.agent, setup.roundupId, cell.id, 'record');
      await moveCell(editor, setup.roundupId, cell.id, 'accept');
      const ofRecord = await editor.post(`/api/runs/${runIds[0]}/run-of-record`).send({});
      expect(ofRecord.status, ofRecord.text).toBe(200);
    }
  }
  if (!options.leaveOpen) await moveRoundup(editor, setup.roundupId, 'writing');
  return { ...setup, products };
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
