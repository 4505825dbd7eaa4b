import { formatMoney } from './money';

/** A roundup's price band: inclusive bounds in one currency, for one region. */
export interface PriceBand {
  minMinor: number;
  maxMinor: number;
  currency: string;
  region: string;
}

export interface PricePoint {
  id: number;
  region: string;
  currency: string;
  amountMinor: number;
  /** Calendar date the price was seen, YYYY-MM-DD. */
  observedOn: string;
}

/**
 * A price older than this no longer counts as current: the product is still compared with the band, but the
 * editor is warned. Common practice in retail price tracking (a quarter), no source.
 */
export const PRICE_STALE_AFTER_DAYS = 90;

export const bandFits = ['in-band', 'below-band', 'above-band', 'other-currency', 'no-price'] as const;
export type BandFit = (typeof bandFits)[number];

export interface BandCheck {
  fit: BandFit;
  /** The latest price in the band's region, whatever its currency. */
  latestPrice: PricePoint | null;
  /** The latest price is older than PRICE_STALE_AFTER_DAYS (or there is none). */
  stale: boolean;
  /** One sentence for the editor, or null when the product is in the band with a current price. */
  warning: string | null;
}

/**
 * The latest price rule: among the prices recorded for the region, the one with the latest observation date
 * counts; two on the same date are decided by the later record (higher id). Older prices are history only,
 * even when one of them would be inside the band.
 */
export function latestPriceInRegion<P extends PricePoint>(prices: readonly P[], region: string): P | null {
  let latest: P | null = null;
  for (const price of prices) {
    if (price.region !== region) continue;
    if (
      latest === null ||
      price.observedOn > latest.observedOn ||
      (price.observedOn === latest.observedOn && price.id > latest.id)
    ) {
      latest = price;
    }
  }
  return latest;
}

/** Whole days from one calendar date to another (YYYY-MM-DD), independent of time zones. */
export function daysBetween(fromDate: string, toDate: string): number {
  return Math.round((Date.parse(`${toDate}T00:00:00Z`) - Date.parse(`${fromDate}T00:00:00Z`)) / 86_400_000);
}

/**
 * Compares a product's latest regional price with the band. Bounds are inclusive. A price in another
 * currency never counts as inside: Benchwire does not convert.
 */
export function checkPriceAgainstBand(band: PriceBand, prices: readonly PricePoint[], today: string): BandCheck {
  const latest = latestPriceInRegion(prices, band.region);
  const range = `${formatMoney(band.minMinor, band.currency)}–${formatMoney(band.maxMinor, band.currency)}`;
  if (!latest) {
    return {
      fit: 'no-price',
      latestPrice: null,
      stale: true,
      warning: `No price recorded in ${band.region}, so it cannot be checked against the band ${range}.`,
    };
  }
  const stale = daysBetween(latest.observedOn, today) > PRICE_STALE_AFTER_DAYS;
  const seen = `${formatMoney(latest.amountMinor, latest.currency)} on ${latest.observedOn}`;
  const staleNote = stale
    ? ` That price is more than ${PRICE_STALE_AFTER_DAYS} days old, so there is no current price: record a new one.`
    : '';
  if (latest.currency !== band.currency) {
    return {
      fit: 'other-currency',
      latestPrice: latest,
      stale,
      warning:
        `The latest price in ${band.region} is in ${latest.currency} (${seen}); the band is in ${band.currency} ` +
        `and prices are not converted, so it does not count as in the band ${range}.${staleNote}`,
    };
  }
  if (latest.amountMinor < band.minMinor || latest.amountMinor > band.maxMinor) {
    const fit: BandFit = latest.amountMinor < band.minMinor ? 'below-band' : 'above-band';
    return {
      fit,
      latestPrice: latest,
      stale,
      warning: `The latest price in ${band.region} (${seen}) is ${fit === 'below-band' ? 'below' : 'above'} the band ${range}.${staleNote}`,
    };
  }
  return {
    fit: 'in-band',
    latestPrice: latest,
    stale,
    warning: stale ? `In the band ${range} at ${seen}.${staleNote}` : null,
  };
}
