import type { ApiRegistry } from '../api-registry';
import type { AppContext } from '../app-context';
import { sendStoredBytes } from '../lib/send-stored-bytes';
import { editorialDeciders, planningReaders } from '../../shared/access/roles';
import { idParamSchema } from '../../shared/schemas/common';
import {
  approveChartRequestSchema,
  chartParamsSchema,
  chartSettingsSchema,
  roundupChartsSchema,
} from '../../shared/schemas/charts';

export function registerChartRoutes(api: ApiRegistry, { services }: AppContext) {
  const charts = services.charts;

  api.add({
    method: 'get',
    path: '/api/roundups/:id/charts',
    access: planningReaders,
    tag: 'Editorial',
    summary:
      'The roundup’s charts: per load configuration, per product, price against temperature; data, status, changes since approval.',
    params: idParamSchema,
    response: roundupChartsSchema,
    handler: ({ params }) => charts.list(params.id),
  });

  api.add({
    method: 'put',
    path: '/api/roundups/:id/charts/:chartKey/settings',
    access: editorialDeciders,
    tag: 'Editorial',
    summary:
      'Choose a chart’s metric, its reference products (configuration charts) or its load configuration (scatter).',
    params: chartParamsSchema,
    body: chartSettingsSchema,
    response: roundupChartsSchema,
    handler: ({ user, params, body }) => charts.updateSettings(user, params.id, params.chartKey, body),
  });

  api.add({
    method: 'post',
    path: '/api/roundups/:id/charts/:chartKey/approval',
    access: editorialDeciders,
    tag: 'Editorial',
    summary:
      'Approve the chart as drawn now: freezes its data and settings and renders its PNG (409 when it changed since viewed).',
    params: chartParamsSchema,
    body: approveChartRequestSchema,
    response: roundupChartsSchema,
    successStatus: 200,
    handler: ({ user, params, body }) => charts.approve(user, params.id, params.chartKey, body.snapshotHash),
  });

  api.add({
    method: 'get',
    path: '/api/roundups/:id/charts/:chartKey/image.png',
    access: planningReaders,
    tag: 'Editorial',
    summary: 'The approved chart’s PNG (1200 × 630) as stored.',
    params: chartParamsSchema,
    produces: 'image/png',
    handler: async ({ params, res }) => {
      const { body, sha256 } = await charts.image(params.id, params.chartKey);
      sendStoredBytes(res, body, 'image/png', 'private, max-age=60', { ETag: `"${sha256}"` });
    },
  });
}
