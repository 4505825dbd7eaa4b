import { useState } from 'react';
import { Badge } from '../../../components/ui/badge';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { DataTable, type DataTableColumns } from '../../../components/ui/data-table';
import { buttonColumn } from '../../../components/ui/data-table-columns';
import { describeSubmitError } from '../../../lib/form-errors';
import type { Price } from '../../../../shared/schemas/catalog';
import { useRemovePrice } from '../api/prices';
import { formatPrice } from '../../../lib/format-money';
import { formatCalendarDate } from '../../../lib/format-time';

export interface PriceHistoryProps {
  productId: number;
  productName: string;
  /** Newest first, as the API sends them. */
  prices: readonly Price[];
  /** The entries the list counts as latest (one per region). */
  latestIds: ReadonlySet<number>;
  /** Editors may remove a mistaken entry. */
  canRemove: boolean;
}

/** Price history grouped by region, newest first in each; the entry that counts as latest is marked. */
export function PriceHistory({ productId, productName, prices, latestIds, canRemove }: PriceHistoryProps) {
  const removePrice = useRemovePrice();
  const [removing, setRemoving] = useState<Price | null>(null);
  const [removeError, setRemoveError] = useState<string | undefined>();
  const regions = [...new Set(prices.map((price) => price.region))].sort();

  // The Remove button names the region, so screen-reader users hear which price it removes.
  const columnsFor = (region: string): DataTableColumns<Price> => [
    {
      id: 'seen',
      header: 'Seen on',
      numeric: true,
      cell: (price) => formatCalendarDate(price.observedOn),
    },
    { id: 'price', header: 'Price', numeric: true, cell: (price) => formatPrice(price) },
    {
      id: 'latest',
      header: 'Counts as latest',
      headerHidden: true,
      cell: (price) => latestIds.has(price.id) && <Badge tone="accent">Latest</Badge>,
    },
    { id: 'source', header: 'Source', cell: (price) => price.source },
    {
      id: 'recordedBy',
      header: 'Recorded by',
      className: 'text-muted',
      cell: (price) => price.recordedBy?.displayName ?? 'Import or former staff',
    },
    canRemove &&
      buttonColumn(
        {
          label: 'Remove',
          name: (price) =>
            `Remove the ${region} price of ${formatPrice(price)} seen ${formatCalendarDate(price.observedOn)}`,
          onClick: (price) => {
            setRemoveError(undefined);
            setRemoving(price);
          },
          variant: 'quiet',
        },
        { headerHidden: true, className: 'text-right' },
      ),
  ];

  if (prices.length === 0) {
    return <p className="text-sm text-muted">No prices recorded yet for {productName}.</p>;
  }

  return (
    <div className="space-y-5">
      {regions.map((region) => {
        const rows = prices.filter((price) => price.region === region);
        return (
          <section key={region} aria-labelledby={`prices-${region}`}>
            <h3
              id={`prices-${region}`}
              className="mb-1.5 font-mono text-xs font-semibold tracking-wide text-muted uppercase"
            >
              {region} · {rows.length} {rows.length === 1 ? 'entry' : 'entries'}
            </h3>
            <DataTable caption={`Prices in ${region}`} rows={rows} columns={columnsFor(region)} />
          </section>
        );
      })}

      <ConfirmDialog
        open={removing !== null}
        title="Remove this price?"
        confirmLabel="Remove price"
        pending={removePrice.isPending}
        error={removeError}
        onCancel={() => setRemoving(null)}
        onConfirm={() => {
          if (!removing) return;
          removePrice.mutate(
            { productId, priceId: removing.id },
            {
              onSuccess: () => setRemoving(null),
              onError: (error) => setRemoveError(describeSubmitError(error).message),
            },
          );
        }}
      >
        {removing && (
          <p>
            {formatPrice(removing)} in {removing.region}, seen {formatCalendarDate(removing.observedOn)} at{' '}
            {removing.source}. Use this for a mistaken entry; a real price change is a new entry instead. The audit log
            keeps what was removed.
          </p>
        )}
      </ConfirmDialog>
    </div>
  );
}
