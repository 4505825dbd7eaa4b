import type { TemperatureUnit } from '../../schemas/analysis';

/**
 * Blank cells and the error markers loggers write for an open or faulty probe become gaps, never zeros. Seen in
 * logger exports: OPEN, ERR/ERROR, FAULT, dashes (----, ---.-), NaN, N/A, #N/A, null, OL/O.L. (overload), OVER/UNDER,
 * ±Inf, ?, *, x.
 */
const gapMarkerPattern =
  /^(?:open|err|error|fault|fail|-[-.]*|nan|n\/?a|#n\/a|null|none|[+-]?inf|[+-]?infinity|ovr|over|overrange|under|underrange|-?ol|-?o\.l\.|\?+|\*+|x+)$/i;

/** Numeric sentinels some loggers write instead of a marker (−999.9, 9999, −99999 …). Checked only for out-of-range values. */
const numericSentinelPattern = /^[+-]?9{3,}(?:[.,]9*)?$/;

const numberWithUnitPattern = /^([+-]?(?:\d+\.?\d*|\.\d+)(?:e[+-]?\d+)?)\s*(°\s*[cf]|deg\s*[cf]|[cfk]|mv)?$/i;

const powersOfTen = [1, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15];

/**
 * Reads a plain decimal ("-12.25", or "-12,25" with a decimal comma) without allocating; NaN for anything else, which
 * then goes through readCell. The digits form an exact integer divided by an exact power of ten, so the result is the
 * correctly rounded value of the written decimal.
 */
export function readPlainDecimal(cell: string, decimalComma: boolean): number {
  const length = cell.length;
  if (length === 0 || length > 17) return Number.NaN;
  const separator = decimalComma ? 44 : 46;
  let index = 0;
  let negative = false;
  let code = cell.charCodeAt(0);
  if (code === 45) {
    negative = true;
    index = 1;
  } else if (code === 43) {
    index = 1;
  }
  let mantissa = 0;
  let digits = 0;
  let decimals = 0;
  let afterSeparator = false;
  for (; index < length; index++) {
    code = cell.charCodeAt(index);
    if (code >= 48 && code <= 57) {
      mantissa = mantissa * 10 + (code - 48);
      digits++;
      if (afterSeparator) decimals++;
    } else if (code === separator && !afterSeparator) {
      afterSeparator = true;
    } else {
      return Number.NaN;
    }
  }
  if (digits === 0) return Number.NaN;
  const value = mantissa / powersOfTen[decimals];
  return negative ? -value : value;
}

export type CellReading =
  { kind: 'number'; value: number; unit: TemperatureUnit | null } | { kind: 'gap' } | { kind: 'invalid' };

const gapReading: CellReading = { kind: 'gap' };
const invalidReading: CellReading = { kind: 'invalid' };

function unitFromSuffix(suffix: string | undefined): TemperatureUnit | null {
  if (!suffix) return null;
  const letter = suffix.toLowerCase().replace(/[°\sdeg]/g, '');
  if (letter === 'c') return 'C';
  if (letter === 'f') return 'F';
  if (letter === 'k') return 'K';
  return 'mV';
}

/** Reads any cell: a number (with an optional unit suffix such as "45.2 °C" or "1.93 mV"), a gap, or invalid. */
export function readCell(cell: string | undefined, decimalComma: boolean): CellReading {
  if (cell === undefined) return gapReading;
  const plain = readPlainDecimal(cell, decimalComma);
  if (plain === plain) return { kind: 'number', value: plain, unit: null };
  const trimmed = cell.trim();
  if (trimmed === '' || gapMarkerPattern.test(trimmed)) return gapReading;
  const normalised = decimalComma ? trimmed.replace(',', '.') : trimmed;
  const match = numberWithUnitPattern.exec(normalised);
  if (!match) return invalidReading;
  return { kind: 'number', value: Number(match[1]), unit: unitFromSuffix(match[2]) };
}

export function isNumericSentinel(cell: string): boolean {
  return numericSentinelPattern.test(cell.trim());
}

/** True for cells that look like data (numbers, times, dates, markers) rather than names, for header detection. */
export function looksLikeData(cell: string, decimalComma: boolean): boolean {
  const trimmed = cell.trim();
  if (trimmed === '') return false;
  if (readCell(trimmed, decimalComma).kind !== 'invalid') return true;
  return /^\d{1,4}[-/.:]\d/.test(trimmed) || /^\d+:\d{2}/.test(trimmed);
}
