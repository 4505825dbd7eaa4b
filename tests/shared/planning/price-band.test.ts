import { describe, expect, it } from 'vitest';
import {
  checkPriceAgainstBand,
  daysBetween,
  latestPriceInRegion,
  PRICE_STALE_AFTER_DAYS,
  type PriceBand,
  type PricePoint,
} from '../../../shared/domain/planning/price-band';

const band: PriceBand = { minMinor: 15000, maxMinor: 22000, currency: 'EUR', region: 'DE' };
const today = '2025-06-10';
let nextId = 1;
const price = (amountMinor: number, observedOn = '2025-06-01', region = 'DE', currency = 'EUR'): PricePoint => ({
  id: nextId++,
  amountMinor,
  observedOn,
  region,
  currency,
});

describe('price band check (first principles: min ≤ latest price ≤ max, same currency, same region)', () => {
  it.each([
    [14999, 'below-band'],
    [15000, 'in-band'],
    [18000, 'in-band'],
    [22000, 'in-band'],
    [22001, 'above-band'],
  ])('a latest price of %i minor units is %s (bounds inclusive)', (amountMinor, fit) => {
    expect(checkPriceAgainstBand(band, [price(amountMinor)], today).fit).toBe(fit);
  });

  it('only the latest price in the band’s region counts; older prices and other regions are history', () => {
    const prices = [price(18000, '2025-05-01'), price(25000, '2025-06-01'), price(16000, '2025-06-05', 'AT')];
    const check = checkPriceAgainstBand(band, prices, today);
    expect(check.fit).toBe('above-band');
    expect(check.latestPrice?.amountMinor).toBe(25000);
    expect(check.warning).toMatch(/above the band €150\.00–€220\.00/);
  });

  it('two prices on the same date: the later record (higher id) is the latest', () => {
    const first = price(16000, '2025-06-01');
    const second = price(30000, '2025-06-01');
    expect(latestPriceInRegion([second, first], 'DE')).toBe(second);
  });

  it('a price in another currency is never in the band, and the warning says it is not converted', () => {
    const check = checkPriceAgainstBand(band, [price(18000, '2025-06-01', 'DE', 'USD')], today);
    expect(check.fit).toBe('other-currency');
    expect(check.warning).toMatch(/in USD .* the band is in EUR and prices are not converted/);
  });

  it('no price in the region is a warning, not a fit', () => {
    const check = checkPriceAgainstBand(band, [price(18000, '2025-06-01', 'GB', 'GBP')], today);
    expect(check).toMatchObject({ fit: 'no-price', latestPrice: null, stale: true });
    expect(check.warning).toMatch(/No price recorded in DE/);
  });

  it(`a price older than ${PRICE_STALE_AFTER_DAYS} days is not current (common practice, no source)`, () => {
    // 2025-03-12 → 2025-06-10 is 90 days: still current; one day earlier is stale.
    expect(daysBetween('2025-03-12', today)).toBe(90);
    expect(checkPriceAgainstBand(band, [price(18000, '2025-03-12')], today)).toMatchObject({
      stale: false,
      warning: null,
    });
    const stale = checkPriceAgainstBand(band, [price(18000, '2025-03-11')], today);
    expect(stale).toMatchObject({ fit: 'in-band', stale: true });
    expect(stale.warning).toMatch(/no current price/);
  });
});
