import { useCallback, useMemo, useState } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Badge } from '../../../components/ui/badge';
import { DataTable, type DataTableColumns } from '../../../components/ui/data-table';
import { buttonColumn, dateColumn, textColumn } from '../../../components/ui/data-table-columns';
import { EmptyState } from '../../../components/ui/empty-state';
import { sampleSourceLabels, sampleStatuses, type Sample } from '../../../../shared/schemas/samples';
import { useSamples } from '../api/get-samples';
import { formatPrice } from '../../../lib/format-money';
import { formatCalendarDate } from '../../../lib/format-time';
import { productDisplayName } from '../../../../shared/domain/planning/product-display-name';
import { overdueText } from './samples-format';
import { SampleDialog } from './sample-dialog';
import { SampleStatusBadge } from './sample-status-badge';
import { countOf, plural } from '../../../lib/plural';

export interface SamplesTableProps {
  roundupId: number;
  /** Editors and testers keep the records; writers read them. */
  canEdit: boolean;
  defaultCurrency: string;
}

/** Where each tested board came from and where it is now; overdue loans stand out in words and colour. */
export function SamplesTable({ roundupId, canEdit, defaultCurrency }: SamplesTableProps) {
  const { samples, timeZone } = useSamples(roundupId);
  const [editing, setEditing] = useState<{ id: number; open: boolean } | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const edited = editing ? (samples.find((s) => s.id === editing.id) ?? null) : null;
  const overdue = samples.filter((s) => s.overdue);

  const startEditing = useCallback((sample: Sample) => {
    setNotice(null);
    setEditing({ id: sample.id, open: true });
  }, []);

  const columns = useMemo<DataTableColumns<Sample>>(
    () => [
      textColumn('product', 'Product', (s) => productDisplayName(s.product), {
        rowHeader: true,
        className: 'min-w-40',
      }),
      textColumn('source', 'Source', (s) => (s.source ? sampleSourceLabels[s.source] : null), {
        className: 'min-w-44',
        cell: (s) =>
          s.source ? (
            <span>
              {sampleSourceLabels[s.source]}
              <span className="block text-xs text-muted">
                {s.source === 'retail'
                  ? [s.orderReference, s.cost && formatPrice(s.cost)].filter(Boolean).join(' · ')
                  : s.vendorContact}
              </span>
            </span>
          ) : (
            <span className="text-muted">Not known yet</span>
          ),
      }),
      {
        id: 'status',
        header: 'Status',
        sortValue: (s) => sampleStatuses.indexOf(s.status),
        filterValue: (s) => s.status,
        cell: (s) => <SampleStatusBadge status={s.status} />,
      },
      dateColumn('received', 'Received', (s) => s.receivedOn, { hideBelow: 'md' }),
      {
        id: 'returnBy',
        header: 'Return by',
        numeric: true,
        sortValue: (s) => s.returnBy,
        cell: (s) =>
          s.returnBy ? (
            <span className={s.overdue ? 'font-semibold text-red' : undefined}>
              {formatCalendarDate(s.returnBy)}
              {s.overdue && (
                <span className="mt-0.5 block">
                  <Badge tone="negative">{overdueText(s.daysOverdue)}</Badge>
                </span>
              )}
            </span>
          ) : (
            <span className="text-muted">—</span>
          ),
      },
      {
        id: 'serial',
        header: 'Serial · firmware',
        hideBelow: 'lg',
        sortValue: (s) => s.serialNumber,
        filterValue: (s) => `${s.serialNumber ?? ''} ${s.firmwareOnArrival ?? ''}`,
        cell: (s) => (
          <span className="numeric whitespace-nowrap">
            {s.serialNumber ?? '—'}
            <span className="block text-muted">{s.firmwareOnArrival ? `fw ${s.firmwareOnArrival}` : 'fw —'}</span>
          </span>
        ),
      },
      canEdit &&
        buttonColumn({
          label: 'Edit',
          name: (s) => `Edit sample: ${productDisplayName(s.product)}`,
          onClick: startEditing,
        }),
    ],
    [canEdit, startEditing],
  );

  return (
    <div className="space-y-3">
      {overdue.length > 0 && (
        <Alert tone="danger" title={`${countOf(overdue.length, 'loan is', 'loans are')} overdue`}>
          {overdue
            .map((s) => `${productDisplayName(s.product)} (${overdueText(s.daysOverdue).toLowerCase()})`)
            .join('; ')}
          . {plural(overdue.length, 'Return it or mark it kept.', 'Return them or mark them kept.')}
        </Alert>
      )}
      {notice && (
        <Alert tone="success" announce>
          {notice}
        </Alert>
      )}
      <DataTable
        caption="Samples"
        rows={samples}
        columns={columns}
        initialSort="product"
        filter="Product, source or status"
        noun={['sample', 'samples']}
        rowClassName={(s) => (s.overdue ? 'bg-red/5' : undefined)}
        empty={
          <EmptyState title="No samples yet">
            Each product tested in this roundup gets a sample record when it is added.
          </EmptyState>
        }
        footnote={`Dates are calendar days in ${timeZone}, the roundup’s time zone. Reference products have no sample: they are not re-tested.`}
      />
      {edited && editing && (
        <SampleDialog
          key={edited.id}
          open={editing.open}
          roundupId={roundupId}
          sample={edited}
          timeZone={timeZone}
          defaultCurrency={defaultCurrency}
          onClose={() => setEditing((current) => (current ? { ...current, open: false } : null))}
          onSaved={(saved) => {
            setEditing((current) => (current ? { ...current, open: false } : null));
            setNotice(`Saved the sample record of ${productDisplayName(saved.product)}.`);
          }}
        />
      )}
    </div>
  );
}
