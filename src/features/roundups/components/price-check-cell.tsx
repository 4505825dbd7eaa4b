import { Badge, type BadgeTone } from '../../../components/ui/badge';
import { formatMoney } from '../../../../shared/domain/planning/money';
import type { PriceCheck } from '../../../../shared/schemas/roundups';
import { formatCalendarDate } from '../../../lib/format-time';

const fitLooks: Record<PriceCheck['fit'], { label: string; tone: BadgeTone }> = {
  'in-band': { label: 'In the band', tone: 'positive' },
  'below-band': { label: 'Below the band', tone: 'caution' },
  'above-band': { label: 'Above the band', tone: 'caution' },
  'other-currency': { label: 'Other currency', tone: 'caution' },
  'no-price': { label: 'No price', tone: 'muted' },
};

/** The latest price in the band's region, how it sits against the band, and the server's warning if any. */
export function PriceCheckCell({ check }: { check: PriceCheck }) {
  const look = fitLooks[check.fit];
  const price = check.latestPrice;
  return (
    <div className="space-y-0.5">
      <div className="flex flex-wrap items-center gap-x-2 gap-y-1">
        {price && <span className="numeric">{formatMoney(price.amountMinor, price.currency)}</span>}
        <Badge tone={look.tone}>{look.label}</Badge>
        {check.stale && price && <Badge tone="muted">Old price</Badge>}
      </div>
      {price && <p className="text-xs text-muted">Seen {formatCalendarDate(price.observedOn)}</p>}
      {check.warning && <p className="text-xs font-medium text-amber">! {check.warning}</p>}
    </div>
  );
}
