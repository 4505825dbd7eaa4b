import type { TimeFormat } from '../../schemas/analysis';
import { readCell, readPlainDecimal } from './log-cell-value';

/** Header names loggers give their time column. */
export const timeHeaderPattern =
  /\b(?:time|zeit|elapsed|timestamp|date|datetime|sec|secs|seconds|ms|runtime)\b|^t\s*(?:$|[([])|^time|time$/i;

const clockPattern = /^(\d+):(\d{1,2})(?::(\d{1,2}))?(?:[.,](\d+))?\s*(?:([ap])\.?m\.?)?$/i;
const yearFirstPattern =
  /^(\d{4})[-/.](\d{1,2})[-/.](\d{1,2})(?:[T\s,]+(\d{1,2}):(\d{2})(?::(\d{2})(?:[.,](\d+))?)?)?\s*(?:([ap])\.?m\.?)?\s*(z|[+-]\d{2}:?\d{2})?$/i;
const dayOrMonthFirstPattern =
  /^(\d{1,2})([-/.])(\d{1,2})\2(\d{2}|\d{4})(?:[T\s,]+(\d{1,2}):(\d{2})(?::(\d{2})(?:[.,](\d+))?)?)?\s*(?:([ap])\.?m\.?)?$/i;

export interface TimeReaderSettings {
  format: TimeFormat;
  decimalComma: boolean;
  /** For d/m/y versus m/d/y stamps. */
  dayFirst: boolean;
}

export interface DateTimeStamp {
  /** Seconds since 1970 of the wall-clock reading, shifted to UTC when the stamp carries an offset. */
  seconds: number;
  hasOffset: boolean;
}

function fractionSeconds(digits: string | undefined): number {
  return digits ? Number(`0.${digits}`) : 0;
}

function hour24(hour: number, meridiem: string | undefined): number {
  if (!meridiem) return hour;
  const pm = meridiem.toLowerCase() === 'p';
  if (hour === 12) return pm ? 12 : 0;
  return pm ? hour + 12 : hour;
}

function offsetSeconds(zone: string | undefined): number {
  if (!zone || zone.toLowerCase() === 'z') return 0;
  const digits = zone.replace(':', '');
  const sign = digits[0] === '-' ? -1 : 1;
  return sign * (Number(digits.slice(1, 3)) * 3600 + Number(digits.slice(3, 5)) * 60);
}

function validWallClock(month: number, day: number, hour: number, minute: number, second: number): boolean {
  return month >= 1 && month <= 12 && day >= 1 && day <= 31 && hour <= 23 && minute <= 59 && second <= 60;
}

/** Reads ISO 8601 and common local date-time stamps; null when the cell is none of them. */
export function readDateTime(cell: string, dayFirst: boolean): DateTimeStamp | null {
  const trimmed = cell.trim();
  let year: number, month: number, day: number;
  let hourText: string | undefined, minuteText: string | undefined, secondText: string | undefined;
  let fraction: string | undefined, meridiem: string | undefined, zone: string | undefined;
  const yearFirst = yearFirstPattern.exec(trimmed);
  if (yearFirst) {
    year = Number(yearFirst[1]);
    month = Number(yearFirst[2]);
    day = Number(yearFirst[3]);
    [hourText, minuteText, secondText, fraction, meridiem, zone] = yearFirst.slice(4);
  } else {
    const local = dayOrMonthFirstPattern.exec(trimmed);
    if (!local) return null;
    const first = Number(local[1]);
    const second = Number(local[3]);
    day = dayFirst ? first : second;
    month = dayFirst ? second : first;
    year = Number(local[4]);
    if (local[4].length === 2) year += 2000;
    [hourText, minuteText, secondText, fraction, meridiem] = local.slice(5);
  }
  if (hourText === undefined) return null;
  const hour = hour24(Number(hourText), meridiem);
  const minute = Number(minuteText);
  const seconds = secondText === undefined ? 0 : Number(secondText);
  if (!validWallClock(month, day, hour, minute, seconds)) return null;
  const wallClock = Date.UTC(year, month - 1, day, hour, minute, seconds) / 1000 + fractionSeconds(fraction);
  return { seconds: wallClock - offsetSeconds(zone), hasOffset: zone !== undefined };
}

/** Reads mm:ss or hh:mm:ss (optionally with fractional seconds and am/pm) as seconds; NaN otherwise. */
export function readClockTime(cell: string): number {
  const match = clockPattern.exec(cell.trim());
  if (!match) return Number.NaN;
  const [, first, second, third, fraction, meridiem] = match;
  if (third === undefined) {
    if (Number(second) > 59) return Number.NaN;
    return Number(first) * 60 + Number(second) + fractionSeconds(fraction);
  }
  if (Number(second) > 59 || Number(third) > 59) return Number.NaN;
  return hour24(Number(first), meridiem) * 3600 + Number(second) * 60 + Number(third) + fractionSeconds(fraction);
}

function elapsedFormatFromHeader(header: string): TimeFormat {
  if (/\bms\b|millisec/i.test(header)) return 'milliseconds';
  if (/\bmin\b|minutes/i.test(header)) return 'minutes';
  return 'seconds';
}

/** Recognises how a time cell is written; the header tells the unit of plain numbers (seconds unless ms or min). */
export function detectTimeFormat(cell: string, header: string): TimeFormat | null {
  const trimmed = cell.trim();
  if (clockPattern.test(trimmed)) return 'clock';
  if (readDateTime(trimmed, true) || readDateTime(trimmed, false)) return 'date-time';
  const reading = readCell(trimmed, true);
  if (reading.kind === 'number' && reading.unit === null) return elapsedFormatFromHeader(header);
  return null;
}

/**
 * d/m/y or m/d/y: decided by any first field above 12 (day first) or second field above 12 (month first); dotted
 * dates are day-first by convention, slashed ones month-first when nothing decides.
 */
export function detectDayFirst(cells: readonly string[]): boolean {
  let dotted = false;
  for (const cell of cells) {
    const match = dayOrMonthFirstPattern.exec(cell.trim());
    if (!match) continue;
    if (Number(match[1]) > 12) return true;
    if (Number(match[3]) > 12) return false;
    if (match[2] === '.') dotted = true;
  }
  return dotted;
}

const elapsedScale: Partial<Record<TimeFormat, number>> = { seconds: 1, milliseconds: 0.001, minutes: 60 };

/** Returns a reader giving seconds (absolute for date-time stamps, as written otherwise) or NaN when unreadable. */
export function createTimeReader(settings: TimeReaderSettings): (cell: string) => number {
  const { format, decimalComma, dayFirst } = settings;
  if (format === 'clock') return readClockTime;
  if (format === 'date-time') return (cell) => readDateTime(cell, dayFirst)?.seconds ?? Number.NaN;
  const scale = elapsedScale[format] ?? 1;
  return (cell) => {
    const plain = readPlainDecimal(cell, decimalComma);
    if (plain === plain) return plain * scale;
    const reading = readCell(cell, decimalComma);
    return reading.kind === 'number' && reading.unit === null ? reading.value * scale : Number.NaN;
  };
}
