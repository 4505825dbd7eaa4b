import { useState } from 'react';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
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
            <div
              role="region"
              aria-label={`Prices in ${region}`}
              tabIndex={0}
              className="overflow-x-auto rounded-[3px] border border-rule"
            >
              <table className="w-full border-collapse text-sm">
                <thead>
                  <tr className="border-b border-edge/70 bg-wash text-xs tracking-wide text-muted uppercase">
                    <th scope="col" className="px-3 py-1.5 text-right font-semibold">
                      Seen on
                    </th>
                    <th scope="col" className="px-3 py-1.5 text-right font-semibold">
                      Price
                    </th>
                    <th scope="col" className="px-1 py-1.5 text-left font-semibold">
                      <span className="sr-only">Counts as latest</span>
                    </th>
                    <th scope="col" className="px-3 py-1.5 text-left font-semibold">
                      Source
                    </th>
                    <th scope="col" className="px-3 py-1.5 text-left font-semibold">
                      Recorded by
                    </th>
                    {canRemove && (
                      <th scope="col" className="px-3 py-1.5 text-left font-semibold">
                        <span className="sr-only">Actions</span>
                      </th>
                    )}
                  </tr>
                </thead>
                <tbody>
                  {rows.map((price) => (
                    <tr key={price.id} className="border-b border-rule last:border-b-0">
                      <td className="numeric px-3 py-1.5 text-right whitespace-nowrap">
                        {formatCalendarDate(price.observedOn)}
                      </td>
                      <td className="numeric px-3 py-1.5 text-right whitespace-nowrap">{formatPrice(price)}</td>
                      <td className="px-1 py-1.5">{latestIds.has(price.id) && <Badge tone="accent">Latest</Badge>}</td>
                      <td className="px-3 py-1.5">{price.source}</td>
                      <td className="px-3 py-1.5 text-muted">
                        {price.recordedBy?.displayName ?? 'Import or former staff'}
                      </td>
                      {canRemove && (
                        <td className="px-3 py-1 text-right">
                          <Button
                            size="sm"
                            variant="quiet"
                            aria-label={`Remove the ${region} price of ${formatPrice(price)} seen ${formatCalendarDate(price.observedOn)}`}
                            onClick={() => {
                              setRemoveError(undefined);
                              setRemoving(price);
                            }}
                          >
                            Remove
                          </Button>
                        </td>
                      )}
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
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
