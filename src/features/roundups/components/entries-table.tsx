import { useMemo } from 'react';
import { Link } from 'react-router';
import { Badge } from '../../../components/ui/badge';
import { DataTable, type DataTableColumns } from '../../../components/ui/data-table';
import { buttonColumn, numericColumn, textColumn } from '../../../components/ui/data-table-columns';
import { EmptyState } from '../../../components/ui/empty-state';
import { formFactorLabels } from '../../../../shared/schemas/catalog';
import { sampleStatusLabels } from '../../../../shared/schemas/samples';
import type { RoundupEntry } from '../../../../shared/schemas/roundups';
import { productDisplayName } from '../../../../shared/domain/planning/product-display-name';
import { paths } from '../../../lib/paths';
import { PriceCheckCell } from './price-check-cell';

export interface EntriesTableProps {
  roundupId: number;
  entries: readonly RoundupEntry[];
  /** Editors may remove entries while the plan is editable. */
  onRemove?: (entry: RoundupEntry) => void;
}

export function EntriesTable({ roundupId, entries, onRemove }: EntriesTableProps) {
  const columns = useMemo<DataTableColumns<RoundupEntry>>(
    () => [
      numericColumn(
        'position',
        '#',
        (e) => e.position,
        (position) => position + 1,
        { hideBelow: 'sm' },
      ),
      textColumn('product', 'Product', (e) => productDisplayName(e.product), {
        rowHeader: true,
        className: 'min-w-40',
        cell: (e) => (
          <span>
            {productDisplayName(e.product)}
            <span className="block text-xs font-normal text-muted">
              {e.product.chipset} · {formFactorLabels[e.product.formFactor]}
              {e.product.archived && ' · archived in the catalog'}
            </span>
          </span>
        ),
      }),
      {
        id: 'kind',
        header: 'Role',
        sortValue: (e) => e.kind,
        cell: (e) =>
          e.kind === 'tested' ? (
            <Badge tone="accent">Tested here</Badge>
          ) : (
            <span>
              <Badge tone="muted">Reference</Badge>
              {e.referenceRoundup && (
                <span className="mt-0.5 block text-xs text-muted">Results from {e.referenceRoundup.title}</span>
              )}
            </span>
          ),
      },
      {
        id: 'price',
        header: 'Latest price',
        sortValue: (e) => e.priceCheck.latestPrice?.amountMinor ?? null,
        cell: (e) => <PriceCheckCell check={e.priceCheck} />,
      },
      {
        id: 'sample',
        header: 'Sample',
        hideBelow: 'md',
        sortValue: (e) => (e.sample ? sampleStatusLabels[e.sample.status] : null),
        cell: (e) =>
          e.sample ? (
            <span>
              {sampleStatusLabels[e.sample.status]}
              {e.sample.overdue && (
                <span className="mt-0.5 block">
                  <Badge tone="negative">Loan overdue</Badge>
                </span>
              )}
            </span>
          ) : (
            <span className="text-muted">None (not re-tested)</span>
          ),
      },
      {
        id: 'photos',
        header: 'Photos',
        cell: (e) => (
          <Link
            to={paths.roundupEntryPhotos(roundupId, e.id)}
            aria-label={`Photos of ${productDisplayName(e.product)}`}
            className="text-copper underline-offset-2 hover:underline"
          >
            Photos
          </Link>
        ),
      },
      onRemove &&
        buttonColumn({
          label: 'Remove',
          name: (e) => `Remove ${productDisplayName(e.product)}`,
          onClick: onRemove,
          variant: 'quiet',
        }),
    ],
    [onRemove, roundupId],
  );

  return (
    <DataTable
      caption="Products in this roundup"
      rows={entries}
      columns={columns}
      initialSort="position"
      filter={{ placeholder: 'Maker or model', aboveRows: 8 }}
      noun={['product', 'products']}
      empty={
        <EmptyState title="No products yet">
          Add boards from the catalog: each tested product becomes a row of the test matrix.
        </EmptyState>
      }
    />
  );
}
