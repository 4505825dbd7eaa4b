import { describe, expect, it } from 'vitest';
import {
  isNumericSentinel,
  looksLikeData,
  readCell,
  readPlainDecimal,
} from '../../../shared/domain/analysis/log-cell-value';

describe('reading one logger cell', () => {
  it.each([
    ['45.25', false, 45.25],
    ['-3.1', false, -3.1],
    ['+7', false, 7],
    ['45,25', true, 45.25],
    ['0.1', false, 0.1],
    ['45,25', false, Number.NaN],
    ['', false, Number.NaN],
    ['-', false, Number.NaN],
  ])(
    'reads plain decimals exactly as written, with a point or a decimal comma: %j (decimal comma %s) → %d',
    (text, decimalComma, expected) => {
      // toBe compares with Object.is, so a refused text must give NaN itself.
      expect(readPlainDecimal(text, decimalComma)).toBe(expected);
    },
  );

  it('turns blank cells and sensor error markers into gaps, never zeros', () => {
    for (const marker of [
      '',
      '   ',
      'OPEN',
      'open',
      'ERR',
      'Error',
      '----',
      '---.-',
      '-',
      'NaN',
      'N/A',
      '#N/A',
      'null',
      'OL',
      'O.L.',
      'OVER',
      '-Inf',
      '?',
    ]) {
      expect(readCell(marker, false), marker).toEqual({ kind: 'gap' });
    }
    expect(readCell(undefined, false)).toEqual({ kind: 'gap' });
  });

  it.each([
    ['45.2 °C', false, 45.2, 'C'],
    ['113.4°F', false, 113.4, 'F'],
    ['318.2 K', false, 318.2, 'K'],
    ['1,931 mV', true, 1.931, 'mV'],
    [' 12.5 ', false, 12.5, null],
  ])('reads a unit written after the number: %j', (text, decimalComma, value, unit) => {
    expect(readCell(text, decimalComma)).toEqual({ kind: 'number', value, unit });
  });

  it('marks anything else invalid', () => {
    expect(readCell('hot', false)).toEqual({ kind: 'invalid' });
    expect(readCell('12.5.3', false)).toEqual({ kind: 'invalid' });
  });

  it.each([
    ['-999.9', true],
    ['9999', true],
    ['812.4', false],
  ])('recognises numeric sentinels such as −999.9 and 9999: %s → %s', (text, sentinel) => {
    expect(isNumericSentinel(text)).toBe(sentinel);
  });

  it.each([
    ['12,5', true],
    ['00:01:02', true],
    ['2025-03-01T09:00:00Z', true],
    ['VRM 1', false],
  ])('tells data from header names: %j → data %s', (text, data) => {
    expect(looksLikeData(text, true)).toBe(data);
  });
});
