import { expect } from 'vitest';
import { createServices } from '../../../../server/compose-services';
import { RoundupScheduleEntity } from '../../../../server/entities/roundup-schedule.entity';
import { RoundupEntity } from '../../../../server/entities/roundup.entity';
import { loadPreviewSecret } from '../../../../server/publishing/preview-links';
import { PublishedPageCache } from '../../../../server/publishing/published-page-cache';
import { readerSiteRenderer } from '../../../../server/publishing/reader-site-renderer';
import { PublishingService } from '../../../../server/services/publishing.service';
import { RunAnalysisEntity } from '../../../../server/entities/run-analysis.entity';
import { SampleEntity } from '../../../../server/entities/sample.entity';
import type { RoundupState } from '../../../../shared/domain/planning/roundup-states';
import { signedIn, testApp, testDataSource, testEnv, type Client } from '../../support/test-app';
import {
  addTestedBoards,
  assignCells,
  createRoundup,
  dayFromToday,
  matrixOf,
  moveToBench,
  pricedProduct,
  recordManualRun,
  tag,
} from '../../planning/support/planning-fixtures';

export interface PlannedRun {
  peakC: number;
  ambientC?: number;
  throttled?: boolean;
  /** The analysis is doctored afterwards to a withheld verdict, as the QA checks give an unfinished soak. */
  withheld?: boolean;
  /** No run of record is chosen for the cell. */
  notOfRecord?: boolean;
}

export interface PublishedFixture {
  roundupId: number;
  title: string;
  platform: string;
  configurationIds: number[];
  products: { productId: number; entryId: number; model: string; maker: string }[];
  runIds: number[][];
  editor: Client;
  tester: Client;
}

/**
 * A roundup with the given boards × configurations measured by hand (one run per cell, accepted and of record), put
 * into `state` (Live by default). Runs are grid[product][configuration].
 */
export async function publishedFixture(
  grid: PlannedRun[][],
  options: {
    state?: RoundupState;
    models?: string[];
    platform?: string;
    configurationIds?: number[];
    prices?: { amountMinor: number; observedOn: string }[][];
  } = {},
): Promise<PublishedFixture> {
  const app = await testApp();
  const editor = await signedIn(app, 'editor');
  const tester = await signedIn(app, 'tester');
  const ds = await testDataSource();
  const configurations = grid[0]?.length ?? 1;
  const setup = await createRoundup(editor.agent, { configurations, platform: options.platform });
  let configurationIds = setup.loadConfigurationIds;
  if (options.configurationIds) {
    const put = await editor.agent
      .put(`/api/roundups/${setup.roundupId}/load-configurations`)
      .send({ loadConfigurationIds: options.configurationIds });
    expect(put.status, put.text).toBe(200);
    configurationIds = options.configurationIds;
  }
  const names = grid.map((_, index) => ({
    model: options.models?.[index] ?? `Testboard ${tag()}`,
    maker: `Vendrel ${tag()}`,
  }));
  const boards = await addTestedBoards(editor.agent, setup, grid.length, (index) =>
    pricedProduct(editor.agent, setup.platform, options.prices?.[index] ?? [], names[index]),
  );
  const products = boards.map((board, index) => ({ ...board, ...names[index] }));
  await moveToBench(editor.agent, setup.roundupId);
  const matrix = await matrixOf(editor.agent, setup.roundupId);
  const cellIds = matrix.rows.flatMap((row) => row.cells.map((cell) => cell.id));
  await assignCells(editor.agent, setup.roundupId, { cellIds }, tester.user.id, dayFromToday(3));

  const runIds: number[][] = [];
  for (const [row, runs] of grid.entries()) {
    const entryRow = matrix.rows.find((r) => r.entryId === products[row].entryId);
    runIds.push([]);
    for (const [column, planned] of runs.entries()) {
      const cell = entryRow?.cells[column];
      if (!cell) throw new Error('cell missing');
      const startedAt = new Date(Date.now() - 86_400_000).toISOString();
      const runId = (await recordManualRun(tester.agent, cell.id, { ...planned, startedAt })).id;
      runIds[row].push(runId);
      const review = await editor.agent
        .post(`/api/runs/${runId}/review`)
        .send({ decision: 'accept', reason: 'Checked.' });
      expect(review.status, review.text).toBe(200);
      if (!planned.notOfRecord) {
        const marked = await editor.agent.post(`/api/runs/${runId}/run-of-record`);
        expect(marked.status, marked.text).toBe(200);
      }
      if (planned.withheld) {
        const analysis = await ds.getRepository(RunAnalysisEntity).findOneByOrFail({ testRunId: runId });
        const result = analysis.result as { verdict: Record<string, unknown> };
        result.verdict = { ...result.verdict, status: 'withheld', code: null, label: 'No verdict yet', judgedC: null };
        await ds.getRepository(RunAnalysisEntity).update({ id: analysis.id }, { result, verdict: null });
      }
    }
  }
  for (const product of products) {
    await ds
      .getRepository(SampleEntity)
      .update({ entryId: product.entryId }, { source: 'retail', firmwareOnArrival: '1.01' });
  }
  const state = options.state ?? 'live';
  if (state === 'live') await publishForReaders(setup.roundupId);
  else await ds.getRepository(RoundupEntity).update({ id: setup.roundupId }, { state });
  const roundup = await ds.getRepository(RoundupEntity).findOneByOrFail({ id: setup.roundupId });
  return {
    roundupId: setup.roundupId,
    title: roundup.title,
    platform: setup.platform,
    configurationIds,
    products,
    runIds,
    editor: editor.agent,
    tester: tester.agent,
  };
}

/**
 * Publishes the roundup as the job runner does at its embargo time (Scheduled → Live, frozen model, rendered pages), a
 * minute ago. These tests are about what readers see of published data, so the editorial readiness check (charts
 * approved, write-up signed off — tested in tests/server/publishing) is not asked here; the write-up's signed-off
 * text and the approved chart images are frozen as in the app.
 */
export async function publishForReaders(roundupId: number) {
  const ds = await testDataSource();
  const services = createServices(ds, testEnv());
  const publishing = new PublishingService(ds, {
    renderer: readerSiteRenderer(ds, {
      // The public address the reader-page tests name (PUBLIC_SITE_URL): canonical and Open Graph links use it.
      baseUrl: 'https://results.test',
      writeUps: services.writeUps,
      chartImages: (id) => services.charts.approvedChartImages(id),
    }),
    pages: new PublishedPageCache(ds),
    previewSecret: () => loadPreviewSecret(ds, undefined),
  });
  const publishAt = new Date(Math.floor(Date.now() / 1000) * 1000 - 60_000);
  const roundup = await ds.getRepository(RoundupEntity).findOneByOrFail({ id: roundupId });
  await ds.getRepository(RoundupEntity).update({ id: roundupId }, { state: 'scheduled', stateChangedAt: publishAt });
  await ds.getRepository(RoundupScheduleEntity).save({
    roundupId,
    publishAt,
    localDate: publishAt.toISOString().slice(0, 10),
    localTime: publishAt.toISOString().slice(11, 19),
    timeZone: 'UTC',
    scheduledBy: roundup.createdBy,
    updatedAt: publishAt,
  });
  expect(await publishing.publishDue(roundupId, new Date())).toBe('published');
}
