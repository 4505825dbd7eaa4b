import type { ParseError } from '../../schemas/analysis';
import { logAnalysisLimits } from '../../upload-limits';

/** The shape limits of shared/upload-limits (logAnalysisLimits), or smaller ones in tests. */
export interface LogShapeLimits {
  maxLineChars: number;
  maxColumns: number;
  maxCells: number;
}

const grouped = (value: number) => value.toLocaleString('en-GB');

/**
 * The first line longer than the limit, found with indexOf alone (no copies), before any parsing: a file of one
 * enormous line would otherwise be split into millions of cells while the header is looked for.
 */
export function lineTooLong(text: string, limits: LogShapeLimits = logAnalysisLimits): ParseError | null {
  // Files from old Mac software end lines with CR alone (the table reader reads them the same way).
  const newline = text.indexOf('\n') < 0 && text.indexOf('\r') >= 0 ? '\r' : '\n';
  let start = 0;
  for (let row = 1; start <= text.length; row++) {
    const end = text.indexOf(newline, start);
    const length = (end < 0 ? text.length : end) - start;
    if (length > limits.maxLineChars) {
      return {
        row,
        column: null,
        code: 'line-too-long',
        message: `Row ${row} is ${grouped(length)} characters long; a logger row has at most ${grouped(limits.maxLineChars)}. Check that the file is a logger export with one sample per line.`,
      };
    }
    if (end < 0) break;
    start = end + 1;
  }
  return null;
}

/** Too many columns, or too many cells in all (data lines × columns), once the header is found. */
export function tableTooLarge(
  headerRow: number,
  columnCount: number,
  lineCount: number,
  limits: LogShapeLimits = logAnalysisLimits,
): ParseError | null {
  if (columnCount > limits.maxColumns) {
    return {
      row: headerRow,
      column: null,
      code: 'too-many-columns',
      message: `The header has ${grouped(columnCount)} columns; Benchwire reads at most ${grouped(limits.maxColumns)}. Export only the channels of this run (time, VRM probes, ambient, clock, power).`,
    };
  }
  const cells = columnCount * lineCount;
  if (cells > limits.maxCells) {
    return {
      row: null,
      column: null,
      code: 'too-many-cells',
      message: `The file has ${grouped(lineCount)} rows × ${grouped(columnCount)} columns = ${grouped(cells)} cells; Benchwire reads at most ${grouped(limits.maxCells)}. Export fewer channels, log at a lower rate, or split the log.`,
    };
  }
  return null;
}
