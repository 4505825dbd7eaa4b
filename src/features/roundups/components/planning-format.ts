import { formatMoney } from '../../../../shared/domain/planning/money';

export interface BandLike {
  minMinor: number;
  maxMinor: number;
  currency: string;
  region: string;
}

/** "€150.00 – €220.00 in DE". */
export function formatBand(band: BandLike): string {
  return `${formatBandRange(band)} in ${band.region}`;
}

/** The band's prices alone, "€150.00 – €220.00", for places that show the region apart. */
export function formatBandRange(band: BandLike): string {
  return `${formatMoney(band.minMinor, band.currency)} – ${formatMoney(band.maxMinor, band.currency)}`;
}

/** Units after a thin space, as on every Benchwire screen: 230.0 W, 1.250 V. */
export function withUnit(value: number, unit: string, decimals: number): string {
  return `${value.toFixed(decimals)}\u2009${unit}`;
}
