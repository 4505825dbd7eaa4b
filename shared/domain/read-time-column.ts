import type { TimeFormat } from '../schemas/analysis';
import { guessColumnRole } from './log-column-guess';
import { createTimeReader, detectDayFirst, detectTimeFormat, readDateTime } from './log-time-value';
import type { LoggerTable } from './logger-table';
import { ParseErrorList, cellLabel } from './parse-error-list';

/** The first column named like a time whose first cell reads as a time, else the first column if it does. */
export function guessTimeColumn(table: LoggerTable): number {
  const firstRow = table.rows[0] ?? [];
  const named = table.columns.flatMap((name, index) => (guessColumnRole(name) === 'time' ? [index] : []));
  for (const index of [...named, 0]) {
    const cell = firstRow[index];
    if (cell !== undefined && detectTimeFormat(cell, table.columns[index]) !== null) return index;
  }
  return -1;
}

const timeFormatExpectations: Record<TimeFormat, string> = {
  seconds: 'elapsed seconds such as 12.5',
  milliseconds: 'elapsed milliseconds such as 12500',
  minutes: 'elapsed minutes such as 1.5',
  clock: 'a time such as 01:02:03 (hh:mm:ss) or 62:03 (mm:ss)',
  'date-time': 'a date-time stamp such as 2024-05-01T10:00:00 or 01.05.2024 10:00:00',
};

const halfDayS = 43_200;
const dayS = 86_400;

/**
 * Reads the time column as seconds from the first sample. Times must increase strictly; a time-of-day column that
 * passes midnight is carried into the next day.
 */
export function readTimeColumn(
  table: LoggerTable,
  index: number,
  errors: ParseErrorList,
): { timeS: Float64Array; format: TimeFormat; startedAt: string | null } | null {
  const column = table.columns[index];
  const { rows, rowNumbers } = table;
  const firstFilled = rows.findIndex((row) => (row[index] ?? '').trim() !== '');
  const format = firstFilled < 0 ? null : detectTimeFormat(rows[firstFilled][index], column);
  if (format === null) {
    const row = firstFilled < 0 ? rowNumbers[0] : rowNumbers[firstFilled];
    const cell = firstFilled < 0 ? '' : rows[firstFilled][index];
    errors.add(
      row,
      column,
      'unparseable-time',
      `${cellLabel(row, column)}: "${cell}" is not a time. Expected elapsed seconds, mm:ss, hh:mm:ss or a date-time stamp such as 2024-05-01T10:00:00.`,
    );
    return null;
  }
  const stampCells =
    format === 'date-time' ? [...rows.slice(0, 50), ...rows.slice(-50)].map((row) => row[index] ?? '') : [];
  const dayFirst = detectDayFirst(stampCells);
  const read = createTimeReader({ format, decimalComma: table.decimalComma, dayFirst });
  const seconds = new Float64Array(rows.length);
  let dayOffset = 0;
  let previous = Number.NaN;
  for (let i = 0; i < rows.length; i++) {
    const cell = rows[i][index] ?? '';
    let value = read(cell);
    if (value !== value) {
      const reason = cell.trim() === '' ? 'the time is missing' : `"${cell}" is not a time`;
      errors.add(
        rowNumbers[i],
        column,
        'unparseable-time',
        `${cellLabel(rowNumbers[i], column)}: ${reason}. Expected ${timeFormatExpectations[format]}, like the first row.`,
      );
      if (errors.full) return null;
      continue;
    }
    // A time-of-day column passes midnight once in a while; elapsed hh:mm:ss never falls by half a day.
    if (format === 'clock' && value + dayOffset < previous - halfDayS) dayOffset += dayS;
    value += dayOffset;
    if (value <= previous) {
      const what = value === previous ? 'repeats the time of the row before' : 'is earlier than the row before';
      errors.add(
        rowNumbers[i],
        column,
        'non-monotonic-time',
        `${cellLabel(rowNumbers[i], column)}: "${cell.trim()}" ${what} (row ${rowNumbers[i - 1]}); times must increase from row to row.`,
      );
      if (errors.full) return null;
    }
    seconds[i] = value;
    previous = value;
  }
  const first = seconds[0];
  for (let i = 0; i < seconds.length; i++) seconds[i] -= first;
  let startedAt: string | null = null;
  if (format === 'date-time') {
    const stamp = readDateTime(rows[0][index] ?? '', dayFirst);
    if (stamp?.hasOffset) startedAt = new Date(stamp.seconds * 1000).toISOString();
  }
  return { timeS: seconds, format, startedAt };
}
