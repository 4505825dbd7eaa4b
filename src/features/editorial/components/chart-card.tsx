import { useState } from 'react';
import { Alert, ListAlert } from '../../../components/ui/alert';
import { Badge, type BadgeTone } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Checkbox } from '../../../components/ui/checkbox';
import { DataTable, type DataTableColumn } from '../../../components/ui/data-table';
import { Panel } from '../../../components/ui/panel';
import { Select } from '../../../components/ui/select';
import { DateTime } from '../../../components/ui/date-time';
import { describeSubmitError } from '../../../lib/form-errors';
import {
  chartMetricNames,
  chartMetrics,
  type ChartMetric,
  type ChartValue,
} from '../../../../shared/domain/editorial/chart-data';
import { chartStatusLabels, type RoundupChart, type ChartSettingsInput } from '../../../../shared/schemas/charts';
import { ChartCanvas } from './chart-canvas';

const statusTones: Record<RoundupChart['status'], BadgeTone> = {
  'not-approved': 'caution',
  approved: 'positive',
  stale: 'negative',
  empty: 'muted',
};

type ChartRow = ChartValue & { priceMinor?: number; priceText?: string };

function ChartTable({ chart }: { chart: RoundupChart['data'] }) {
  const rows: ChartRow[] = chart.kind === 'price-scatter' ? chart.points : chart.bars;
  const columns: DataTableColumn<ChartRow>[] = [
    {
      id: 'label',
      header: chart.kind === 'product' ? 'Load configuration' : 'Product',
      rowHeader: true,
      sortValue: (row) => row.label,
      cell: (row) => (
        <>
          {row.label}
          {row.role === 'reference' && <span className="text-muted"> (reference: {row.referenceRoundupTitle})</span>}
        </>
      ),
    },
    ...(chart.kind === 'price-scatter'
      ? [
          {
            id: 'price',
            header: 'Price',
            numeric: true,
            sortValue: (row: ChartRow) => row.priceMinor ?? null,
            cell: (row: ChartRow) => row.priceText,
          },
        ]
      : []),
    {
      id: 'value',
      header: chart.axisLabel,
      numeric: true,
      sortValue: (row) => row.value,
      cell: (row) => row.valueText,
    },
    {
      id: 'tolerance',
      header: 'Tolerance',
      numeric: true,
      cell: (row) => (row.whiskerC === null ? '—' : `±${row.whiskerC.toFixed(1)}\u2009°C`),
    },
    { id: 'marks', header: 'Marks', cell: (row) => row.marks.join(', ') || '—' },
  ];
  return (
    <details className="mt-3 text-sm">
      <summary className="cursor-pointer text-copper">Data table</summary>
      <div className="mt-2">
        <DataTable caption={chart.title} rows={rows} columns={columns} rowKey={(row) => row.key} />
      </div>
    </details>
  );
}

export interface ChartCardProps {
  chart: RoundupChart;
  loadConfigurations: { id: number; name: string }[];
  canDecide: boolean;
  approving: boolean;
  savingSettings: boolean;
  onApprove: () => Promise<unknown>;
  onSettings: (settings: ChartSettingsInput) => Promise<unknown>;
}

/** One chart: drawn, its status and what changed since approval, its settings and the approve button. */
export function ChartCard({
  chart,
  loadConfigurations,
  canDecide,
  approving,
  savingSettings,
  onApprove,
  onSettings,
}: ChartCardProps) {
  const [metric, setMetric] = useState<ChartMetric>(chart.settings.metric);
  const [references, setReferences] = useState<number[] | null>(chart.settings.referenceEntryIds);
  const [configuration, setConfiguration] = useState<number | null>(chart.settings.loadConfigurationId);
  const [error, setError] = useState<string>();
  const dirty =
    metric !== chart.settings.metric ||
    JSON.stringify(references) !== JSON.stringify(chart.settings.referenceEntryIds) ||
    configuration !== chart.settings.loadConfigurationId;
  const shownReferences = references ?? chart.referenceChoices.filter((c) => c.measured).map((c) => c.entryId);
  const values = chart.data.kind === 'price-scatter' ? chart.data.points : chart.data.bars;

  const run = async (action: () => Promise<unknown>) => {
    setError(undefined);
    try {
      await action();
    } catch (failure) {
      setError(describeSubmitError(failure).message);
    }
  };

  return (
    <Panel
      id={chart.key}
      title={chart.title}
      actions={<Badge tone={statusTones[chart.status]}>{chartStatusLabels[chart.status]}</Badge>}
      bodyClassName="space-y-3"
    >
      {chart.status === 'stale' && (
        <ListAlert tone="warning" title="Changed since it was approved: approve it again" items={chart.changes} />
      )}
      {values.length > 0 ? (
        <ChartCanvas
          chart={chart.data}
          label={`${chart.title}. ${values.map((v) => `${v.label}: ${v.valueText}${v.marks.length ? ` (${v.marks.join(', ')})` : ''}`).join('; ')}.`}
        />
      ) : (
        <p className="text-sm text-muted">Nothing to draw yet: no product has a figure this chart can show.</p>
      )}
      {chart.data.omitted.length > 0 && (
        <div className="text-sm">
          <p className="font-semibold text-ink">Left off the chart</p>
          <ul className="list-disc pl-5 text-muted">
            {chart.data.omitted.map((o) => (
              <li key={`${o.label}-${o.reason}`}>
                {o.label}: {o.reason}
              </li>
            ))}
          </ul>
        </div>
      )}
      {values.length > 0 && <ChartTable chart={chart.data} />}
      {chart.approval && (
        <p className="text-sm text-muted">
          Approved by {chart.approval.approvedBy?.displayName ?? 'former staff'},{' '}
          <DateTime value={chart.approval.approvedAt} />.
          {chart.approval.imageUrl && (
            <>
              {' '}
              <a href={chart.approval.imageUrl} className="text-copper underline" target="_blank" rel="noreferrer">
                Approved image (PNG)
              </a>
            </>
          )}
        </p>
      )}
      {canDecide && (
        <div className="space-y-3 border-t border-rule pt-3">
          <div className="grid gap-3 sm:grid-cols-2">
            <Select
              label="Metric"
              value={metric}
              onChange={(event) => setMetric(event.target.value as ChartMetric)}
              options={chartMetrics.map((m) => ({ value: m, label: chartMetricNames[m] }))}
            />
            {chart.kind === 'price-scatter' && (
              <Select
                label="Load configuration"
                value={String(configuration ?? loadConfigurations[0]?.id ?? '')}
                onChange={(event) => setConfiguration(Number(event.target.value))}
                options={loadConfigurations.map((c) => ({ value: String(c.id), label: c.name }))}
              />
            )}
          </div>
          {chart.kind === 'configuration' && chart.referenceChoices.length > 0 && (
            <fieldset>
              <legend className="mb-1 text-sm font-semibold text-ink">Reference products from earlier roundups</legend>
              <div className="space-y-1">
                {chart.referenceChoices.map((choice) => (
                  <Checkbox
                    key={choice.entryId}
                    label={`${choice.productName} (${choice.roundupTitle})${choice.measured ? '' : ' — not measured under this load'}`}
                    checked={shownReferences.includes(choice.entryId)}
                    disabled={!choice.measured}
                    onChange={(event) =>
                      setReferences(
                        event.target.checked
                          ? [...shownReferences, choice.entryId]
                          : shownReferences.filter((id) => id !== choice.entryId),
                      )
                    }
                  />
                ))}
              </div>
            </fieldset>
          )}
          {error && (
            <Alert tone="danger" announce>
              {error}
            </Alert>
          )}
          <div className="flex flex-wrap gap-2">
            <Button
              disabled={!dirty}
              pending={savingSettings}
              onClick={() =>
                run(() =>
                  onSettings({
                    metric,
                    referenceEntryIds: chart.kind === 'configuration' ? references : null,
                    loadConfigurationId: chart.kind === 'price-scatter' ? configuration : null,
                  }),
                )
              }
            >
              Save chart settings
            </Button>
            {chart.status !== 'approved' && chart.status !== 'empty' && (
              <Button variant="primary" disabled={dirty} pending={approving} onClick={() => run(onApprove)}>
                {chart.status === 'stale' ? 'Approve again' : 'Approve chart'}
              </Button>
            )}
          </div>
          {dirty && <p className="text-xs text-muted">Save the settings first; then approve what the chart shows.</p>}
        </div>
      )}
    </Panel>
  );
}
