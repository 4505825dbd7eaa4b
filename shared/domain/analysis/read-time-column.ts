import type { TimeFormat } from '../../schemas/analysis';
import { guessColumnRole } from './log-column-guess';
import { createTimeReader, detectDayFirst, detectTimeFormat, readDateTime } from './log-time-value';
import { isBlankRow, type LoggerTable } from './logger-table';
import { ParseErrorList, cellLabel } from './parse-error-list';

/** Index of the first sample row that is not blank, -1 when there is none. */
export function firstDataRowIndex(table: LoggerTable): number {
  return table.sampleRows.findIndex((row) => !isBlankRow(row));
}

/** The first column named like a time whose first cell reads as a time, else the first column if it does. */
export function guessTimeColumn(table: LoggerTable): number {
  const firstRow = table.sampleRows[firstDataRowIndex(table)] ?? [];
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
 * Reads one time cell after another, in file order: times must not go back (repeats are judged afterwards, see
 * spreadRepeatedStamps), and a time-of-day column that passes midnight is carried into the next day. Each refusal is listed with its row and column.
 */
export class TimeColumnReader {
  private readonly read: (cell: string) => number;
  private dayOffset = 0;
  private previous = Number.NaN;
  private previousRow = 0;

  constructor(
    private readonly column: string,
    readonly format: TimeFormat,
    private readonly dayFirst: boolean,
    decimalComma: boolean,
    private readonly errors: ParseErrorList,
  ) {
    this.read = createTimeReader({ format, decimalComma, dayFirst });
  }

  /** Seconds as written (since 1970 for date-time stamps), or NaN when the cell is refused. */
  next(cell: string, row: number): number {
    let value = this.read(cell);
    if (value !== value) {
      const reason = cell.trim() === '' ? 'the time is missing' : `"${cell}" is not a time`;
      this.errors.add(
        row,
        this.column,
        'unparseable-time',
        `${cellLabel(row, this.column)}: ${reason}. Expected ${timeFormatExpectations[this.format]}, like the first row.`,
      );
      return Number.NaN;
    }
    // A time-of-day column passes midnight once in a while; elapsed hh:mm:ss never falls by half a day.
    if (this.format === 'clock' && value + this.dayOffset < this.previous - halfDayS) this.dayOffset += dayS;
    value += this.dayOffset;
    // A repeated stamp is kept for now: spreadRepeatedStamps accepts repeats at a steady rate and refuses the rest.
    if (value < this.previous) {
      this.errors.add(
        row,
        this.column,
        'non-monotonic-time',
        `${cellLabel(row, this.column)}: "${cell.trim()}" is earlier than the row before (row ${this.previousRow}); times must increase from row to row.`,
      );
    }
    this.previous = value;
    this.previousRow = row;
    return value;
  }

  /** UTC instant of a stamp that carries a zone offset, else null. */
  startedAt(firstCell: string): string | null {
    if (this.format !== 'date-time') return null;
    const stamp = readDateTime(firstCell, this.dayFirst);
    return stamp?.hasOffset ? new Date(stamp.seconds * 1000).toISOString() : null;
  }
}

/**
 * Decides the time column's format from its first filled cell, and the order of day and month from the first lines;
 * null (with the error listed) when the first cell is no time.
 */
export function openTimeColumn(table: LoggerTable, index: number, errors: ParseErrorList): TimeColumnReader | null {
  const column = table.columns[index];
  const rows = table.sampleRows;
  const firstFilled = rows.findIndex((row) => (row[index] ?? '').trim() !== '');
  const format = firstFilled < 0 ? null : detectTimeFormat(rows[firstFilled][index], column);
  if (format === null) {
    const row = table.firstRowNumber + Math.max(0, firstFilled);
    const cell = firstFilled < 0 ? '' : rows[firstFilled][index];
    errors.add(
      row,
      column,
      'unparseable-time',
      `${cellLabel(row, column)}: "${cell}" is not a time. Expected elapsed seconds, mm:ss, hh:mm:ss or a date-time stamp such as 2024-05-01T10:00:00.`,
    );
    return null;
  }
  const stampCells = format === 'date-time' ? rows.map((row) => row[index] ?? '') : [];
  return new TimeColumnReader(column, format, detectDayFirst(stampCells), table.decimalComma, errors);
}
