import {
  analysisRequestSchema,
  type AnalysisOptions,
  type AnalysisRequestInput,
  type AnalysisResult,
  type ColumnMapping,
  type LogPreview,
  type ParseError,
} from '../../schemas/analysis';
import { guessColumnMapping, guessColumnRole, unitFromColumnName } from './log-column-guess';
import { detectTimeFormat } from './log-time-value';
import { lineTooLong, tableTooLarge, type LogShapeLimits } from './log-shape-limits';
import { loggerFileText } from './logger-file-text';
import { isBlankRow, parseLoggerTable, type LoggerTable } from './logger-table';
import { readMappedLog, type MappedLog } from './read-mapped-log';
import { firstDataRowIndex, guessTimeColumn, openTimeColumn } from './read-time-column';
import { ParseErrorList } from './parse-error-list';
import { repeatedStampsNote, spreadRepeatedStamps } from './repeated-time-stamps';
import { analyseRun } from './run-analysis';

/** Data rows shown in the preview. */
export const previewRowCount = 20;

export type LogPreviewOutcome =
  { ok: true; preview: LogPreview; table: LoggerTable } | { ok: false; preview: null; errors: ParseError[] };

export type AnalyseLogOutcome =
  /** `mapping`: the mapping the analysis used (the request's, the guessed one, or the one chooseMapping made). */
  | { ok: true; preview: LogPreview; analysis: AnalysisResult; mapping: ColumnMapping }
  | { ok: false; preview: LogPreview | null; errors: ParseError[] };

/** The same, for the bytes of a file: `notText` when they are not a text export at all (a spreadsheet, an image). */
export type AnalyseLogFileOutcome = AnalyseLogOutcome | { ok: false; notText: true };

/** The mapping the analysis uses and whether any of it was guessed (the analysis then flags 'mapping-guessed'). */
export interface ChosenMapping {
  mapping: ColumnMapping | null;
  guessed: boolean;
}

export interface AnalyseLogHooks {
  /**
   * Chooses the mapping from the preview, for callers that let the tester name some roles and guess the rest (the lab
   * CLI). Without it: the request's mapping, or the guessed one when the request has none.
   */
  chooseMapping?: (preview: LogPreview) => ChosenMapping;
  /** Shape limits other than shared/upload-limits' (tests). */
  limits?: LogShapeLimits;
}

function previewRows(table: LoggerTable): string[][] {
  const rows: string[][] = [];
  for (const row of table.sampleRows) {
    if (rows.length === previewRowCount) break;
    if (!isBlankRow(row)) rows.push(row);
  }
  return rows;
}

/**
 * The repeated-stamp note from the first rows, before any analysis: a 2 Hz logger stamping whole seconds is told
 * about on the read panel already. Null when the first rows' stamps do not repeat at a steady rate (or do not read).
 */
function previewTimeNote(table: LoggerTable, timeIndex: number): string | null {
  if (timeIndex < 0) return null;
  const errors = new ParseErrorList();
  const reader = openTimeColumn(table, timeIndex, errors);
  if (!reader) return null;
  const times: number[] = [];
  const rowNumbers: number[] = [];
  table.sampleRows.forEach((row, index) => {
    if (isBlankRow(row)) return;
    const rowNumber = table.firstRowNumber + index;
    times.push(reader.next(row[timeIndex] ?? '', rowNumber));
    rowNumbers.push(rowNumber);
  });
  if (!errors.isEmpty || times.length < 2) return null;
  const repeated = spreadRepeatedStamps(
    Float64Array.from(times),
    Int32Array.from(rowNumbers),
    table.columns[timeIndex],
    errors,
  );
  return repeated && errors.isEmpty ? repeatedStampsNote(repeated, { ahead: true }) : null;
}

function buildPreview(table: LoggerTable): LogPreview {
  const timeIndex = guessTimeColumn(table);
  const timeColumn = timeIndex < 0 ? null : table.columns[timeIndex];
  return {
    delimiter: table.delimiter,
    decimalSeparator: table.decimalComma ? ',' : '.',
    preambleLines: table.preambleLines,
    headerRow: table.headerRow,
    columns: table.columns.map((name, index) => ({
      index,
      name,
      guessedRole: index === timeIndex ? 'time' : guessColumnRole(name) === 'time' ? 'other' : guessColumnRole(name),
      guessedUnit: unitFromColumnName(name),
    })),
    timeColumn,
    timeFormat:
      timeColumn === null ? null : detectTimeFormat(table.sampleRows[firstDataRowIndex(table)][timeIndex], timeColumn),
    rows: previewRows(table),
    dataRowCount: table.lineCount,
    timeNote: previewTimeNote(table, timeIndex),
    guessedMapping: guessColumnMapping(table.columns, timeColumn),
  };
}

/**
 * First step of an upload: how Benchwire reads the file (delimiter, header, columns, guessed roles), no analysis.
 * A file over the shape limits (line length, columns, cells) is refused here, before the heavy work.
 */
export function previewLog(text: string, limits?: LogShapeLimits): LogPreviewOutcome {
  const longLine = lineTooLong(text, limits);
  if (longLine) return { ok: false, preview: null, errors: [longLine] };
  const parsed = parseLoggerTable(text);
  if (!parsed.ok) return { ok: false, preview: null, errors: parsed.errors };
  const { table } = parsed;
  const tooLarge = tableTooLarge(table.headerRow, table.columns.length, table.lineCount, limits);
  if (tooLarge) return { ok: false, preview: null, errors: [tooLarge] };
  return { ok: true, preview: buildPreview(table), table };
}

export type ReadOutcome =
  | { ok: true; preview: LogPreview; log: MappedLog; mapping: ColumnMapping; guessed: boolean }
  | { ok: false; preview: LogPreview | null; errors: ParseError[] };

/**
 * Reads the file and the mapped columns. Kept apart from the analysis so that the raw table (every cell as a string)
 * is out of reach once the columns are read, and the collector can drop it while the analysis runs.
 */
function readLog(
  text: string,
  choose: (preview: LogPreview) => ChosenMapping,
  options: AnalysisOptions,
  limits: LogShapeLimits | undefined,
): ReadOutcome {
  const previewed = previewLog(text, limits);
  if (!previewed.ok) return previewed;
  const { preview, table } = previewed;
  const { mapping: chosen, guessed } = choose(preview);
  if (!chosen) {
    return {
      ok: false,
      preview,
      errors: [
        {
          row: table.headerRow,
          column: null,
          code: 'mapping-incomplete',
          message: `No VRM probe column could be guessed from the header (${table.columns.join(', ')}): choose the VRM columns.`,
        },
      ],
    };
  }
  const mapped = readMappedLog(table, chosen, options);
  return mapped.ok
    ? { ok: true, preview, log: mapped.log, mapping: chosen, guessed }
    : { ok: false, preview, errors: mapped.errors };
}

/** Without a hook: the request's mapping, or the guessed one when the request has none. */
function requestedMapping(mapping: ColumnMapping | undefined): (preview: LogPreview) => ChosenMapping {
  return (preview) => (mapping ? { mapping, guessed: false } : { mapping: preview.guessedMapping, guessed: true });
}

/**
 * The whole engine behind Log check (POST /api/log-check/analyse, the lab CLI's `analyse`): read the logger file,
 * apply the tester's mapping (or the guessed one, flagged), analyse the run. Pure; bad input comes back as parse
 * errors with row and column.
 */
export function analyseLog(
  text: string,
  requestInput: AnalysisRequestInput,
  hooks: AnalyseLogHooks = {},
): AnalyseLogOutcome {
  const request = analysisRequestSchema.parse(requestInput);
  const choose = hooks.chooseMapping ?? requestedMapping(request.mapping);
  const read = readLog(text, choose, request.options, hooks.limits);
  if (!read.ok) return read;
  const analysis = analyseRun(read.log, request.options, { mappingGuessed: read.guessed });
  return { ok: true, preview: read.preview, analysis, mapping: read.mapping };
}

/** analyseLog on the bytes of an uploaded or local file, read with the one logger-file text decoder. */
export function analyseLogFile(
  bytes: Uint8Array,
  requestInput: AnalysisRequestInput,
  hooks: AnalyseLogHooks = {},
): AnalyseLogFileOutcome {
  const text = loggerFileText(bytes);
  if (text === null) return { ok: false, notText: true };
  return analyseLog(text, requestInput, hooks);
}

/**
 * The first half of analyseLogFile, for the Log check chart: the file's mapped series, read by the same decoder and
 * reader with the same mapping rule, without the analysis.
 */
export function readLogFile(
  bytes: Uint8Array,
  requestInput: AnalysisRequestInput,
): ReadOutcome | { ok: false; notText: true } {
  const text = loggerFileText(bytes);
  if (text === null) return { ok: false, notText: true };
  const request = analysisRequestSchema.parse(requestInput);
  return readLog(text, requestedMapping(request.mapping), request.options, undefined);
}
