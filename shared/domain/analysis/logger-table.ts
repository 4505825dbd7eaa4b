import Papa from 'papaparse';
import type { ParseError } from '../../schemas/analysis';
import { looksLikeData } from './log-cell-value';
import { ParseErrorList, cellLabel } from './parse-error-list';

export type Delimiter = ',' | ';' | '\t';

/**
 * A logger export located: preamble, delimiter, decimal separator, header, and the first rows as strings. The data
 * rows themselves are not kept: forEachDataRow streams them from the text, so a 25 MB upload never becomes hundreds of
 * megabytes of cell strings, and each row is read while it is fresh.
 */
export interface LoggerTable {
  delimiter: Delimiter;
  decimalComma: boolean;
  preambleLines: string[];
  /** 1-based line of the header in the file. */
  headerRow: number;
  columns: string[];
  /** The first lines after the header as papaparse split them (blank lines included): sample row i is line firstRowNumber + i. */
  sampleRows: string[][];
  firstRowNumber: number;
  /** Lines after the header, blank lines inside the data included, trailing ones not. */
  lineCount: number;
  text: string;
  /** Offset of the first line after the header in `text`. */
  bodyOffset: number;
}

export type LoggerTableOutcome = { ok: true; table: LoggerTable } | { ok: false; errors: ParseError[] };

const delimiterCandidates: Delimiter[] = ['\t', ';', ','];
/** Loggers write a few lines of preamble (device, start time, interval); the header is found within these lines. */
const headerSearchLines = 200;
/** Data rows checked after a candidate header. */
const headerConfirmRows = 5;
const decimalCommaPattern = /^\s*[+-]?\d+,\d+\s*$/;
const decimalCommaSampleRows = 50;

function isBlank(row: readonly string[]): boolean {
  for (const cell of row) if (cell.trim() !== '') return false;
  return true;
}

/** A blank line, or one of delimiters only. The first cell decides for almost every data row without a full check. */
export function isBlankRow(row: readonly string[]): boolean {
  const first = row[0];
  if (first !== undefined && first.length > 0 && first.charCodeAt(0) > 32) return false;
  return isBlank(row);
}

/** Cells up to the last non-empty one. */
export function filledWidth(row: readonly string[]): number {
  let width = row.length;
  while (width > 0 && row[width - 1].trim() === '') width--;
  return width;
}

function isHeaderLike(row: readonly string[]): boolean {
  const filled = row.filter((cell) => cell.trim() !== '');
  if (row.length < 2 || filled.length < 2) return false;
  const names = filled.filter((cell) => !looksLikeData(cell, true)).length;
  return names * 2 >= filled.length;
}

function isDataLike(row: readonly string[], headerWidth: number): boolean {
  const width = filledWidth(row);
  if (width < 2 || width > headerWidth) return false;
  let data = 0;
  let filled = 0;
  for (let index = 0; index < width; index++) {
    if (row[index].trim() === '') continue;
    filled++;
    if (looksLikeData(row[index], true)) data++;
  }
  return data >= 1 && data * 2 >= filled;
}

/**
 * The header is the first row of mostly names followed by rows of mostly data that fit under it. At least half of the
 * next few rows must be data, so one bad row does not hide the header (it is reported with its row number later),
 * while a preamble line followed by a wider header is not taken for the header.
 */
function findHeader(rows: readonly string[][]): number {
  for (let index = 0; index < rows.length; index++) {
    if (!isHeaderLike(rows[index])) continue;
    const width = rows[index].length;
    let checked = 0;
    let data = 0;
    for (let next = index + 1; next < rows.length && checked < headerConfirmRows; next++) {
      if (isBlank(rows[next])) continue;
      checked++;
      if (isDataLike(rows[next], width)) data++;
    }
    if (data >= 1 && data * 2 >= checked) return index;
  }
  return -1;
}

function lineStartOffset(text: string, line: number): number {
  let offset = 0;
  for (let current = 0; current < line; current++) {
    const next = text.indexOf('\n', offset);
    if (next < 0) return text.length;
    offset = next + 1;
  }
  return offset;
}

function uniqueColumnNames(header: readonly string[]): string[] {
  const seen = new Map<string, number>();
  return header.map((raw, index) => {
    const base = raw.trim() || `Column ${index + 1}`;
    const count = (seen.get(base.toLowerCase()) ?? 0) + 1;
    seen.set(base.toLowerCase(), count);
    return count === 1 ? base : `${base} (${count})`;
  });
}

function noHeaderError(sampleRows: readonly string[][]): ParseError {
  const dataRow = sampleRows.findIndex((row) => row.some((cell) => looksLikeData(cell, true)));
  if (dataRow < 0) {
    const headerRow = sampleRows.findIndex(isHeaderLike);
    return {
      row: headerRow >= 0 ? headerRow + 2 : null,
      column: null,
      code: 'no-numeric-data',
      message:
        'No numeric data: expected a header row of column names followed by rows of numbers (a time and one value per channel).',
    };
  }
  return {
    row: dataRow + 1,
    column: null,
    code: 'no-header',
    message: `${cellLabel(dataRow + 1, null)}: expected a header row of column names (for example Time, VRM 1, Ambient) above the numeric rows, with the columns separated by commas, semicolons or tabs.`,
  };
}

/** Finds preamble, delimiter, decimal separator and header from the first lines; the data rows are streamed later. */
export function parseLoggerTable(input: string): LoggerTableOutcome {
  let text = input.charCodeAt(0) === 0xfeff ? input.slice(1) : input;
  if (text.indexOf('\n') < 0 && text.indexOf('\r') >= 0) text = text.replace(/\r/g, '\n');
  // A regular-expression test stops at the first printable character; trim() would copy the whole file.
  if (!/\S/.test(text)) {
    return { ok: false, errors: [{ row: null, column: null, code: 'empty-file', message: 'The file is empty.' }] };
  }

  const sampleEnd = lineStartOffset(text, headerSearchLines);
  const sample = text.slice(0, sampleEnd);
  let best: { delimiter: Delimiter; rows: string[][]; headerIndex: number } | null = null;
  let fallbackRows: string[][] = [];
  for (const delimiter of delimiterCandidates) {
    const rows = Papa.parse<string[]>(sample, { delimiter, skipEmptyLines: false }).data;
    if (delimiter === ',') fallbackRows = rows;
    const headerIndex = findHeader(rows);
    if (headerIndex < 0) continue;
    if (!best || rows[headerIndex].length > best.rows[best.headerIndex].length) best = { delimiter, rows, headerIndex };
  }
  if (!best) return { ok: false, errors: [noHeaderError(fallbackRows)] };

  const { delimiter, headerIndex } = best;
  const bodyOffset = lineStartOffset(text, headerIndex + 1);
  const columns = uniqueColumnNames(best.rows[headerIndex]);
  const preambleLines = text
    .slice(0, lineStartOffset(text, headerIndex))
    .split('\n')
    .map((line) => line.trimEnd())
    .filter((line) => line !== '');
  const sampleRows = best.rows.slice(headerIndex + 1);
  while (sampleRows.length > 0 && isBlankRow(sampleRows[sampleRows.length - 1])) sampleRows.pop();

  let decimalComma = false;
  if (delimiter !== ',') {
    for (let index = 0; index < Math.min(sampleRows.length, decimalCommaSampleRows) && !decimalComma; index++) {
      decimalComma = sampleRows[index].some((cell) => decimalCommaPattern.test(cell));
    }
  }

  return {
    ok: true,
    table: {
      delimiter,
      decimalComma,
      preambleLines,
      headerRow: headerIndex + 1,
      columns,
      sampleRows,
      firstRowNumber: headerIndex + 2,
      lineCount: countLines(text, bodyOffset),
      text,
      bodyOffset,
    },
  };
}

/** Lines from `offset` to the end, not counting trailing blank lines; indexOf keeps it free of allocations. */
function countLines(text: string, offset: number): number {
  let end = text.length;
  while (end > offset && text.charCodeAt(end - 1) <= 32) end--;
  if (end <= offset) return 0;
  let lines = 1;
  for (let next = text.indexOf('\n', offset); next >= 0 && next < end; next = text.indexOf('\n', next + 1)) lines++;
  return lines;
}

/** Chunk of text papaparse splits at a time while streaming: small enough that each chunk's rows die young. */
const streamChunkChars = 256 * 1024;

/**
 * Streams the data rows to `visit` in file order with their 1-based line, blank lines included; returns the rows
 * papaparse could not split (unbalanced quotes).
 */
export function forEachDataRow(table: LoggerTable, visit: (row: string[], line: number) => void): ParseError[] {
  const errors = new ParseErrorList();
  let line = table.firstRowNumber;
  Papa.parse<string[]>(table.text.slice(table.bodyOffset), {
    delimiter: table.delimiter,
    skipEmptyLines: false,
    chunkSize: streamChunkChars,
    // Streaming a string runs synchronously, chunk after chunk; the typings want a completion callback.
    complete: () => undefined,
    chunk: (results: Papa.ParseResult<string[]>) => {
      const chunkFirstLine = line;
      for (const error of results.errors) {
        const row = error.row === undefined ? null : chunkFirstLine + error.row;
        errors.add(row, null, 'malformed-row', `${cellLabel(row, null)}: ${error.message}.`);
      }
      const rows = results.data;
      for (let index = 0; index < rows.length; index++) visit(rows[index], line++);
    },
  });
  return errors.list();
}
