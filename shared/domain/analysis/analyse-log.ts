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
import { isBlankRow, parseLoggerTable, type LoggerTable } from './logger-table';
import { readMappedLog, type MappedLog } from './read-mapped-log';
import { firstDataRowIndex, guessTimeColumn } from './read-time-column';
import { analyseRun } from './run-analysis';

/** Data rows shown in the preview. */
export const previewRowCount = 20;

export type LogPreviewOutcome =
  { ok: true; preview: LogPreview; table: LoggerTable } | { ok: false; preview: null; errors: ParseError[] };

export type AnalyseLogOutcome =
  | { ok: true; preview: LogPreview; analysis: AnalysisResult }
  | { ok: false; preview: LogPreview | null; errors: ParseError[] };

function previewRows(table: LoggerTable): string[][] {
  const rows: string[][] = [];
  for (const row of table.sampleRows) {
    if (rows.length === previewRowCount) break;
    if (!isBlankRow(row)) rows.push(row);
  }
  return rows;
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
    guessedMapping: guessColumnMapping(table.columns, timeColumn),
  };
}

/** First step of an upload: how Benchwire reads the file (delimiter, header, columns, guessed roles), no analysis. */
export function previewLog(text: string): LogPreviewOutcome {
  const parsed = parseLoggerTable(text);
  if (!parsed.ok) return { ok: false, preview: null, errors: parsed.errors };
  return { ok: true, preview: buildPreview(parsed.table), table: parsed.table };
}

type ReadOutcome =
  { ok: true; preview: LogPreview; log: MappedLog } | { ok: false; preview: LogPreview | null; errors: ParseError[] };

/**
 * Reads the file and the mapped columns. Kept apart from the analysis so that the raw table (every cell as a string)
 * is out of reach once the columns are read, and the collector can drop it while the analysis runs.
 */
function readLog(text: string, mapping: ColumnMapping | undefined, options: AnalysisOptions): ReadOutcome {
  const previewed = previewLog(text);
  if (!previewed.ok) return previewed;
  const { preview, table } = previewed;
  const chosen = mapping ?? preview.guessedMapping;
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
  return mapped.ok ? { ok: true, preview, log: mapped.log } : { ok: false, preview, errors: mapped.errors };
}

/**
 * The whole engine behind POST /api/log-check/analyse: read the logger file, apply the tester's mapping (or the
 * guessed one, flagged), analyse the run. Pure; bad input comes back as parse errors with row and column.
 */
export function analyseLog(text: string, requestInput: AnalysisRequestInput): AnalyseLogOutcome {
  const request = analysisRequestSchema.parse(requestInput);
  const read = readLog(text, request.mapping, request.options);
  if (!read.ok) return read;
  const analysis = analyseRun(read.log, request.options, { mappingGuessed: request.mapping === undefined });
  return { ok: true, preview: read.preview, analysis };
}
