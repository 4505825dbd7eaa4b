import { describe, expect, it } from 'vitest';
import {
  formatMoney,
  isKnownCurrency,
  minorToMajorString,
  minorUnitDigits,
  parseMajorAmount,
} from '../../../shared/domain/planning/money';

describe('money in integer minor units (ISO 4217 minor-unit column)', () => {
  it.each([
    ['EUR', 2],
    ['JPY', 0],
    ['KWD', 3],
  ])('knows the minor unit digits: %s %i', (currency, digits) => {
    expect(minorUnitDigits(currency)).toBe(digits);
  });

  it.each([
    ['189.99', 'EUR', 18999],
    ['189.9', 'EUR', 18990],
    ['189', 'EUR', 18900],
    // 0.1 + 0.2 style errors do not appear: 0.29 is 29 cents exactly.
    ['0.29', 'EUR', 29],
    ['1500', 'JPY', 1500],
    ['1.250', 'KWD', 1250],
  ])('parses typed amounts without floating point: %s %s is %i minor units', (text, currency, amountMinor) => {
    expect(parseMajorAmount(text, currency)).toEqual({ ok: true, amountMinor });
  });

  it('refuses grouping, too many decimals and non-numbers', () => {
    expect(parseMajorAmount('1,299.00', 'EUR').ok).toBe(false);
    expect(parseMajorAmount('189.999', 'EUR')).toMatchObject({
      ok: false,
      message: 'EUR has 2 decimal places at most.',
    });
    expect(parseMajorAmount('15.5', 'JPY')).toMatchObject({
      ok: false,
      message: 'JPY has no minor unit: write a whole number.',
    });
    expect(parseMajorAmount('about 200', 'EUR').ok).toBe(false);
  });

  it('writes amounts back for CSV and forms', () => {
    expect(minorToMajorString(18999, 'EUR')).toBe('189.99');
    expect(minorToMajorString(5, 'EUR')).toBe('0.05');
    expect(minorToMajorString(1500, 'JPY')).toBe('1500');
    expect(formatMoney(18999, 'EUR')).toBe('€189.99');
    expect(formatMoney(1500, 'JPY')).toBe('JP¥1,500');
  });

  it('recognises ISO 4217 codes', () => {
    expect(isKnownCurrency('EUR')).toBe(true);
    expect(isKnownCurrency('eur')).toBe(false);
    expect(isKnownCurrency('EUX')).toBe(false);
  });
});
