import { z } from 'zod';
import { instantSchema, pathIdSchema } from './common';
import { namedRefSchema, personRefSchema } from './planning-fields';
import { chartMetrics } from '../domain/editorial/chart-data';

export const chartMetricSchema = z.enum(chartMetrics, 'Choose peak, rise over ambient or normalised peak.');

export const chartSettingsSchema = z.strictObject({
  metric: chartMetricSchema,
  /** Reference entries to show; null: every reference measured under the configuration. */
  referenceEntryIds: z.array(z.number().int().positive()).max(50).nullable(),
  /** For the price scatter: the load configuration it plots; null: the roundup's first. */
  loadConfigurationId: z.number().int().positive().nullable(),
});
export type ChartSettingsInput = z.input<typeof chartSettingsSchema>;

export const chartParamsSchema = z.object({
  id: pathIdSchema,
  /** configuration-<id>, product-<entry id> or price-scatter; a key that names no chart of the roundup is 404. */
  chartKey: z.string().regex(/^[a-z0-9-]{1,40}$/, 'That is not a chart of a roundup.'),
});

export const approveChartRequestSchema = z.strictObject({
  /** The hash of the chart the editor looked at: approval is refused (409) when the chart changed since. */
  snapshotHash: z
    .string()
    .regex(/^[0-9a-f]{64}$/, 'Reload the chart and approve again.')
    .optional(),
});

const chartValueSchema = z.object({
  key: z.string(),
  label: z.string(),
  role: z.enum(['roundup', 'reference']),
  value: z.number(),
  valueText: z.string(),
  whiskerC: z.number().nullable(),
  throttled: z.boolean(),
  manual: z.boolean(),
  provisional: z.boolean(),
  marks: z.array(z.string()),
  verdictLabel: z.string().nullable(),
  referenceRoundupTitle: z.string().nullable(),
  runId: z.number().int(),
  analysisId: z.number().int(),
});
const omissionSchema = z.object({ label: z.string(), reason: z.string() });

export const chartDataSchema = z.discriminatedUnion('kind', [
  z.object({
    kind: z.enum(['configuration', 'product']),
    key: z.string(),
    title: z.string(),
    axisLabel: z.string(),
    footnote: z.string(),
    metric: chartMetricSchema,
    bars: z.array(chartValueSchema),
    omitted: z.array(omissionSchema),
  }),
  z.object({
    kind: z.literal('price-scatter'),
    key: z.string(),
    title: z.string(),
    axisLabel: z.string(),
    priceAxisLabel: z.string(),
    currency: z.string(),
    footnote: z.string(),
    metric: chartMetricSchema,
    points: z.array(
      chartValueSchema.extend({
        priceMinor: z.number().int(),
        priceText: z.string(),
        priceSource: z.enum(['verdict', 'catalog']),
      }),
    ),
    omitted: z.array(omissionSchema),
  }),
]);

export const chartStatuses = ['not-approved', 'approved', 'stale', 'empty'] as const;
export const chartStatusLabels: Record<(typeof chartStatuses)[number], string> = {
  'not-approved': 'Not approved',
  approved: 'Approved',
  stale: 'Stale: needs re-approval',
  empty: 'Nothing to draw',
};

export const roundupChartSchema = z.object({
  key: z.string(),
  kind: z.enum(['configuration', 'product', 'price-scatter']),
  title: z.string(),
  settings: chartSettingsSchema,
  data: chartDataSchema,
  /** SHA-256 of the settings and data as drawn now; approving sends it back. */
  snapshotHash: z.string(),
  status: z.enum(chartStatuses),
  approval: z
    .object({
      approvedBy: personRefSchema.nullable(),
      approvedAt: instantSchema,
      imageUrl: z.string().nullable(),
      imageSha256: z.string().nullable(),
      /** The chart as approved (shown beside the current one when stale). */
      data: chartDataSchema,
    })
    .nullable(),
  /** What changed since approval, in words; empty unless stale. */
  changes: z.array(z.string()),
  /** Configuration charts: the reference entries the editor may show, and whether each was measured here. */
  referenceChoices: z.array(
    z.object({ entryId: z.number().int(), productName: z.string(), roundupTitle: z.string(), measured: z.boolean() }),
  ),
});
export type RoundupChart = z.infer<typeof roundupChartSchema>;

export const roundupChartsSchema = z.object({
  roundupId: z.number().int(),
  editable: z.boolean(),
  loadConfigurations: z.array(namedRefSchema),
  charts: z.array(roundupChartSchema),
});
export type RoundupCharts = z.infer<typeof roundupChartsSchema>;
