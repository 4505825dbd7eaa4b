import type { RoundupEntity } from '../../server/entities/roundup.entity';

/** A live Helix-1700 motherboard roundup as a row, straight into the table (mail needs no planning steps). */
export function liveRoundupRow(title: string): Partial<RoundupEntity> {
  return {
    title,
    category: 'motherboard',
    platform: 'Helix-1700',
    state: 'live',
    priceMinMinor: 10000,
    priceMaxMinor: 30000,
    currency: 'EUR',
    region: 'EU',
    timeZone: 'Europe/Berlin',
    stateChangedAt: new Date(),
  };
}
