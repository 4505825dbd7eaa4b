import { formatMoney } from '../../../../shared/domain/planning/money';

const calendarDate = new Intl.DateTimeFormat('en-GB', {
  day: '2-digit',
  month: 'short',
  year: 'numeric',
  timeZone: 'UTC',
});

/** "14 Mar 2025" for a calendar date (YYYY-MM-DD); no zone shifts it, because it has none. */
export function formatCalendarDate(date: string): string {
  const [year, month, day] = date.split('-').map(Number);
  return calendarDate.format(new Date(Date.UTC(year, month - 1, day)));
}

export interface BandLike {
  minMinor: number;
  maxMinor: number;
  currency: string;
  region: string;
}

/** "€150.00 – €220.00 in DE". */
export function formatBand(band: BandLike): string {
  return `${formatMoney(band.minMinor, band.currency)} – ${formatMoney(band.maxMinor, band.currency)} in ${band.region}`;
}

export function productName(product: { maker: string; model: string }): string {
  return `${product.maker} ${product.model}`;
}

/** Units after a thin space, as on every Benchwire screen: 230.0 W, 1.250 V. */
export function withUnit(value: number, unit: string, decimals: number): string {
  return `${value.toFixed(decimals)}\u2009${unit}`;
}
