import { describe, expect, it } from 'vitest';
import {
  isNumericSentinel,
  looksLikeData,
  readCell,
  readPlainDecimal,
} from '../../../shared/domain/analysis/log-cell-value';

describe('reading one logger cell', () => {
  it('reads plain decimals exactly as written, with a point or a decimal comma', () => {
    expect(readPlainDecimal('45.25', false)).toBe(45.25);
    expect(readPlainDecimal('-3.1', false)).toBe(-3.1);
    expect(readPlainDecimal('+7', false)).toBe(7);
    expect(readPlainDecimal('45,25', true)).toBe(45.25);
    expect(readPlainDecimal('0.1', false)).toBe(0.1);
    expect(readPlainDecimal('45,25', false)).toBeNaN();
    expect(readPlainDecimal('', false)).toBeNaN();
    expect(readPlainDecimal('-', false)).toBeNaN();
  });

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

  it('reads a unit written after the number', () => {
    expect(readCell('45.2 °C', false)).toEqual({ kind: 'number', value: 45.2, unit: 'C' });
    expect(readCell('113.4°F', false)).toEqual({ kind: 'number', value: 113.4, unit: 'F' });
    expect(readCell('318.2 K', false)).toEqual({ kind: 'number', value: 318.2, unit: 'K' });
    expect(readCell('1,931 mV', true)).toEqual({ kind: 'number', value: 1.931, unit: 'mV' });
    expect(readCell(' 12.5 ', false)).toEqual({ kind: 'number', value: 12.5, unit: null });
  });

  it('marks anything else invalid', () => {
    expect(readCell('hot', false)).toEqual({ kind: 'invalid' });
    expect(readCell('12.5.3', false)).toEqual({ kind: 'invalid' });
  });

  it('recognises numeric sentinels such as −999.9 and 9999', () => {
    expect(isNumericSentinel('-999.9')).toBe(true);
    expect(isNumericSentinel('9999')).toBe(true);
    expect(isNumericSentinel('812.4')).toBe(false);
  });

  it('tells data from header names', () => {
    expect(looksLikeData('12,5', true)).toBe(true);
    expect(looksLikeData('00:01:02', true)).toBe(true);
    expect(looksLikeData('2025-03-01T09:00:00Z', true)).toBe(true);
    expect(looksLikeData('VRM 1', true)).toBe(false);
  });
});
