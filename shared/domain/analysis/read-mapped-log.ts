import type { AnalysisOptions, ColumnMapping, ParseError, TemperatureUnit, TimeFormat } from '../../schemas/analysis';
import { isNumericSentinel, readCell, readPlainDecimal } from './log-cell-value';
import { unitFromColumnName } from './log-column-guess';
import { filledWidth, forEachDataRow, isBlankRow, type LoggerTable } from './logger-table';
import { ParseErrorList, cellLabel } from './parse-error-list';
import { guessTimeColumn, openTimeColumn, type TimeColumnReader } from './read-time-column';
import { repeatedStampsNote, spreadRepeatedStamps } from './repeated-time-stamps';
import { celsiusFrom, temperatureUnitLabels } from './temperature-units';
import { typeKCelsiusFromMillivolts, typeKInverseRangeMv, typeKMillivoltsFromCelsius } from './type-k-thermocouple';

/**
 * Benchwire's sanity limits for one reading. A bench room and a working board stay far inside them; a value outside
 * is a wrong unit, a wrong column or a logger fault, so the upload is refused with the cell named.
 */
export const plausibleReadings = {
  temperatureC: { min: -50, max: 250 },
  clockMHz: { min: 0, max: 10_000 },
  powerW: { min: 0, max: 2_000 },
} as const;

export interface MappedTemperatureChannel {
  column: string;
  unit: TemperatureUnit;
  /** °C per sample; NaN is a gap. */
  valuesC: Float64Array;
}

export interface MappedSeries {
  column: string;
  /** NaN is a gap. */
  values: Float64Array;
}

/** A log reduced to what the analysis needs, in SI-ish units: seconds, °C, MHz, W. */
export interface MappedLog {
  /** Seconds since the first sample, strictly increasing. */
  timeS: Float64Array;
  /** UTC instant of the first sample when the stamps carry a zone offset. */
  startedAt: string | null;
  timeColumn: string;
  timeFormat: TimeFormat;
  rowNumbers: Int32Array;
  vrm: MappedTemperatureChannel[];
  ambient: MappedTemperatureChannel | null;
  clockMHz: MappedSeries | null;
  powerW: MappedSeries | null;
  /** How the time column was read, when that needs saying (repeated stamps spread evenly). */
  readNotes?: string[];
}

export type MappedLogOutcome = { ok: true; log: MappedLog } | { ok: false; errors: ParseError[] };

type ReadOptions = Pick<AnalysisOptions, 'unit' | 'coldJunction'>;

/** A header name (case-insensitive) or a 1-based column position; -1 when neither matches. */
export function resolveColumn(columns: readonly string[], reference: string): number {
  const wanted = reference.trim().toLowerCase();
  const byName = columns.findIndex((name) => name.toLowerCase() === wanted);
  if (byName >= 0) return byName;
  if (/^\d+$/.test(wanted)) {
    const position = Number(wanted);
    if (position >= 1 && position <= columns.length) return position - 1;
  }
  return -1;
}

interface RawColumn {
  values: Float64Array;
  suffixUnit: TemperatureUnit | null;
  suffixRow: number | null;
  /** Kept rows whose cell was written as a numeric sentinel (−999.9, 9999 …): a gap if out of range after conversion. */
  sentinels: Set<number>;
}

/** The data rows that carry a reading, compacted: blank lines dropped, each with its file line. */
interface LogRows {
  count: number;
  timeS: Float64Array;
  rowNumbers: Int32Array;
  raws: RawColumn[];
  /** The first kept time cell as written, for the start instant of zoned stamps. */
  startCell: string;
}

function readSlowCell(
  table: LoggerTable,
  row: number,
  index: number,
  cell: string,
  raw: RawColumn,
  errors: ParseErrorList,
): number {
  const reading = readCell(cell, table.decimalComma);
  if (reading.kind === 'gap') return Number.NaN;
  const column = table.columns[index];
  if (reading.kind === 'invalid') {
    const example = table.decimalComma ? '45,2 (decimal comma)' : '45.2';
    errors.add(
      row,
      column,
      'not-a-number',
      `${cellLabel(row, column)}: "${cell.trim()}" is not a number. Expected a number such as ${example}, a blank cell or an error marker such as OPEN, ERR or ----.`,
    );
    return Number.NaN;
  }
  if (reading.unit !== null) {
    if (raw.suffixUnit === null) {
      raw.suffixUnit = reading.unit;
      raw.suffixRow = row;
    } else if (reading.unit !== raw.suffixUnit) {
      errors.add(
        row,
        column,
        'mixed-units',
        `${cellLabel(row, column)}: the value is in ${temperatureUnitLabels[reading.unit]}, but row ${raw.suffixRow} of the same column is in ${temperatureUnitLabels[raw.suffixUnit]}. Export one unit per column.`,
      );
    }
  }
  return reading.value;
}

/** Smallest magnitude a numeric sentinel (999, −999.9, 9999 …) can have; below it no cell needs the pattern test. */
const sentinelMagnitude = 999;

/**
 * One pass over the streamed rows: skips blank lines, refuses rows wider than the header, reads the time and every
 * mapped numeric column while the row is fresh, and keeps nothing of the row but numbers. Plain decimals take the
 * allocation-free path, anything else (markers, unit suffixes, bad cells) the slow one. The returned raw columns
 * follow `indexes`; a column mapped twice gets its own copy, since unit conversions work in place.
 */
function readLogRows(
  table: LoggerTable,
  time: TimeColumnReader,
  timeIndex: number,
  indexes: readonly number[],
  errors: ParseErrorList,
): LogRows {
  const { decimalComma } = table;
  const width = table.columns.length;
  const capacity = table.lineCount;
  const unique = [...new Set(indexes)];
  const raws = unique.map((): RawColumn => ({
    values: new Float64Array(capacity),
    suffixUnit: null,
    suffixRow: null,
    sentinels: new Set(),
  }));
  const arrays = raws.map((raw) => raw.values);
  const columnCount = unique.length;
  const timeS = new Float64Array(capacity);
  const rowNumbers = new Int32Array(capacity);
  let count = 0;
  let startCell = '';
  const structural = forEachDataRow(table, (row, line) => {
    if (isBlankRow(row) || count >= capacity) return;
    if (row.length > width && filledWidth(row) > width) {
      errors.add(
        line,
        null,
        'extra-cells',
        `${cellLabel(line, null)}: ${filledWidth(row)} cells, but the header (row ${table.headerRow}) names ${width} columns.`,
      );
      return;
    }
    const timeCell = row[timeIndex] ?? '';
    const seconds = time.next(timeCell, line);
    if (seconds !== seconds) return;
    if (count === 0) startCell = timeCell;
    timeS[count] = seconds;
    rowNumbers[count] = line;
    for (let k = 0; k < columnCount; k++) {
      const cell = row[unique[k]];
      let value = Number.NaN;
      if (cell !== undefined && cell !== '') {
        value = readPlainDecimal(cell, decimalComma);
        if (value !== value) value = readSlowCell(table, line, unique[k], cell, raws[k], errors);
        if ((value >= sentinelMagnitude || value <= -sentinelMagnitude) && isNumericSentinel(cell)) {
          raws[k].sentinels.add(count);
        }
      }
      arrays[k][count] = value;
    }
    count++;
  });
  for (const error of structural) errors.add(error.row, error.column, error.code, error.message);
  const handedOut = new Set<number>();
  const columns = indexes.map((index) => {
    const raw = raws[unique.indexOf(index)];
    const values = raw.values.subarray(0, count);
    if (handedOut.has(index)) return { ...raw, values: new Float64Array(values) };
    handedOut.add(index);
    return { ...raw, values };
  });
  return {
    count,
    timeS: timeS.subarray(0, count),
    rowNumbers: rowNumbers.subarray(0, count),
    raws: columns,
    startCell,
  };
}

function mappedUnit(mapping: ColumnMapping, column: string): TemperatureUnit | undefined {
  const units = mapping.units ?? {};
  const key = Object.keys(units).find((name) => name.trim().toLowerCase() === column.toLowerCase());
  return key === undefined ? undefined : units[key];
}

function resolveUnit(
  table: LoggerTable,
  column: string,
  raw: RawColumn,
  explicit: TemperatureUnit | undefined,
  fallback: TemperatureUnit,
  errors: ParseErrorList,
): TemperatureUnit {
  const fromHeader = unitFromColumnName(column);
  if (explicit && fromHeader && explicit !== fromHeader) {
    errors.add(
      table.headerRow,
      column,
      'mixed-units',
      `${cellLabel(table.headerRow, column)}: the header says ${temperatureUnitLabels[fromHeader]} but the mapping says ${temperatureUnitLabels[explicit]}.`,
    );
  }
  const declared = explicit ?? fromHeader;
  if (declared && raw.suffixUnit && declared !== raw.suffixUnit) {
    errors.add(
      raw.suffixRow,
      column,
      'mixed-units',
      `${cellLabel(raw.suffixRow, column)}: the value is in ${temperatureUnitLabels[raw.suffixUnit]}, but the column is declared in ${temperatureUnitLabels[declared]}.`,
    );
  }
  return declared ?? raw.suffixUnit ?? fallback;
}

function absurd(
  table: LoggerTable,
  rowNumbers: Int32Array,
  i: number,
  index: number,
  errors: ParseErrorList,
  described: string,
  expected: string,
): void {
  const row = rowNumbers[i];
  const column = table.columns[index];
  errors.add(
    row,
    column,
    'absurd-value',
    `${cellLabel(row, column)}: ${described} is not a plausible reading (expected ${expected}). Check the unit and the column, or mark faulty samples with OPEN, ERR or ----.`,
  );
}

const temperatureRangeText = `${plausibleReadings.temperatureC.min}…${plausibleReadings.temperatureC.max} °C`;

/** Converts a raw column to °C in place, turning implausible readings into errors (or gaps for sentinels). */
function toCelsius(
  table: LoggerTable,
  rowNumbers: Int32Array,
  index: number,
  { values: raw, sentinels }: RawColumn,
  unit: TemperatureUnit,
  coldJunctionC: Float64Array | number | null,
  errors: ParseErrorList,
): Float64Array {
  const { min, max } = plausibleReadings.temperatureC;
  const out = raw;
  const fixedJunctionMv = typeof coldJunctionC === 'number' ? typeKMillivoltsFromCelsius(coldJunctionC) : 0;
  for (let i = 0; i < raw.length; i++) {
    const value = raw[i];
    if (value !== value) {
      out[i] = Number.NaN;
      continue;
    }
    let celsius: number;
    if (unit === 'mV') {
      let junctionMv = fixedJunctionMv;
      if (coldJunctionC instanceof Float64Array) {
        const junction = coldJunctionC[i];
        if (junction !== junction) {
          out[i] = Number.NaN;
          continue;
        }
        junctionMv = typeKMillivoltsFromCelsius(junction);
      }
      const totalMv = value + junctionMv;
      if (totalMv < typeKInverseRangeMv.min || totalMv > typeKInverseRangeMv.max) {
        if (sentinels.has(i)) {
          out[i] = Number.NaN;
          continue;
        }
        absurd(
          table,
          rowNumbers,
          i,
          index,
          errors,
          `${value} mV`,
          `type K ${typeKInverseRangeMv.min}…${typeKInverseRangeMv.max} mV after cold-junction compensation`,
        );
        out[i] = Number.NaN;
        continue;
      }
      celsius = typeKCelsiusFromMillivolts(totalMv);
    } else {
      celsius = celsiusFrom(value, unit);
    }
    if (celsius < min || celsius > max) {
      out[i] = Number.NaN;
      if (!sentinels.has(i)) {
        absurd(table, rowNumbers, i, index, errors, `${value} ${temperatureUnitLabels[unit]}`, temperatureRangeText);
      }
      continue;
    }
    out[i] = celsius;
  }
  return out;
}

function checkRange(
  table: LoggerTable,
  rowNumbers: Int32Array,
  index: number,
  { values, sentinels }: RawColumn,
  range: { min: number; max: number },
  unitLabel: string,
  errors: ParseErrorList,
): void {
  for (let i = 0; i < values.length; i++) {
    const value = values[i];
    if (value !== value || (value >= range.min && value <= range.max)) continue;
    values[i] = Number.NaN;
    if (sentinels.has(i)) continue;
    absurd(table, rowNumbers, i, index, errors, `${value} ${unitLabel}`, `${range.min}…${range.max} ${unitLabel}`);
  }
}

/**
 * Reads the mapped columns of a logger table into a MappedLog: times in seconds from the first sample, temperatures in
 * °C (type K millivolts converted with cold-junction compensation), clock in MHz, package power in W. Every refusal
 * names the row and column.
 */
export function readMappedLog(table: LoggerTable, mapping: ColumnMapping, options: ReadOptions): MappedLogOutcome {
  const errors = new ParseErrorList();
  const { columns } = table;
  const resolve = (reference: string | null | undefined, role: string): number | null => {
    if (reference === undefined || reference === null) return null;
    const index = resolveColumn(columns, reference);
    if (index < 0) {
      errors.add(
        table.headerRow,
        reference,
        'unknown-column',
        `The ${role} column "${reference}" is not in the header (row ${table.headerRow}). Columns: ${columns.join(', ')}.`,
      );
      return null;
    }
    return index;
  };

  const timeIndex = mapping.time ? resolve(mapping.time, 'time') : guessTimeColumn(table);
  if (timeIndex === -1) {
    errors.add(
      table.headerRow,
      null,
      'no-time-column',
      `No time column found: name one in the mapping. Columns: ${columns.join(', ')}.`,
    );
  }
  const vrmIndexes = mapping.vrm.map((reference) => resolve(reference, 'VRM'));
  const ambientIndex = resolve(mapping.ambient, 'ambient');
  const clockIndex = resolve(mapping.clock, 'clock');
  const powerIndex = resolve(mapping.power, 'power');
  const junction = options.coldJunction;
  const junctionIndex = junction && 'column' in junction ? resolve(junction.column, 'cold-junction') : null;
  if (!errors.isEmpty || timeIndex === null || timeIndex < 0) return { ok: false, errors: errors.list() };

  const time = openTimeColumn(table, timeIndex, errors);
  if (!time) return { ok: false, errors: errors.list() };

  const vrmColumns = vrmIndexes as number[];
  const optional = (index: number | null) => (index === null ? [] : [index]);
  const numericIndexes = [
    ...optional(junctionIndex),
    ...vrmColumns,
    ...optional(ambientIndex),
    ...optional(clockIndex),
    ...optional(powerIndex),
  ];
  const { count, timeS, rowNumbers, raws, startCell } = readLogRows(table, time, timeIndex, numericIndexes, errors);
  if (!errors.isEmpty) return { ok: false, errors: errors.list() };
  if (count < 2) {
    errors.add(
      rowNumbers[0] ?? table.firstRowNumber,
      null,
      'too-few-rows',
      'The log has fewer than two data rows; a soak needs a series of readings.',
    );
    return { ok: false, errors: errors.list() };
  }
  const repeated = spreadRepeatedStamps(timeS, rowNumbers, columns[timeIndex], errors);
  if (!errors.isEmpty) return { ok: false, errors: errors.list() };
  const startedAt = time.startedAt(startCell);
  const firstSeconds = timeS[0];
  for (let i = 0; i < count; i++) timeS[i] -= firstSeconds;

  let cursor = 0;
  const junctionRaw = junctionIndex === null ? null : raws[cursor++];
  const vrmRaws = vrmColumns.map(() => raws[cursor++]);
  const ambientRaw = ambientIndex === null ? null : raws[cursor++];
  const clockRaw = clockIndex === null ? null : raws[cursor++];
  const powerRaw = powerIndex === null ? null : raws[cursor++];

  let junctionC: Float64Array | number | null = junction && 'fixedC' in junction ? junction.fixedC : null;
  if (junctionIndex !== null && junctionRaw !== null) {
    const column = columns[junctionIndex];
    const unit = resolveUnit(table, column, junctionRaw, mappedUnit(mapping, column), 'C', errors);
    if (unit === 'mV') {
      errors.add(
        table.headerRow,
        column,
        'mixed-units',
        `${cellLabel(null, column)}: a cold junction is a temperature, not millivolts.`,
      );
    } else {
      junctionC = toCelsius(table, rowNumbers, junctionIndex, junctionRaw, unit, null, errors);
    }
  }

  const readTemperature = (index: number, raw: RawColumn): MappedTemperatureChannel => {
    const column = columns[index];
    const unit = resolveUnit(table, column, raw, mappedUnit(mapping, column), options.unit ?? 'C', errors);
    if (unit === 'mV' && junctionC === null) {
      errors.add(
        null,
        column,
        'cold-junction-missing',
        `${cellLabel(null, column)} is in raw thermocouple millivolts: give the cold-junction temperature (a fixed °C value or the logger's cold-junction column).`,
      );
      return { column, unit, valuesC: raw.values.fill(Number.NaN) };
    }
    return { column, unit, valuesC: toCelsius(table, rowNumbers, index, raw, unit, junctionC, errors) };
  };
  const vrm = vrmColumns.map((index, k) => readTemperature(index, vrmRaws[k]));
  const ambient = ambientIndex === null || ambientRaw === null ? null : readTemperature(ambientIndex, ambientRaw);

  const readSeries = (index: number, raw: RawColumn, range: { min: number; max: number }, unit: string, scale = 1) => {
    const { values } = raw;
    if (scale !== 1) for (let i = 0; i < values.length; i++) values[i] *= scale;
    checkRange(table, rowNumbers, index, raw, range, unit, errors);
    return { column: columns[index], values };
  };
  const clockScale = clockIndex !== null && /\bghz\b/i.test(columns[clockIndex]) ? 1000 : 1;
  const clockMHz =
    clockIndex === null || clockRaw === null
      ? null
      : readSeries(clockIndex, clockRaw, plausibleReadings.clockMHz, 'MHz', clockScale);
  const powerW =
    powerIndex === null || powerRaw === null ? null : readSeries(powerIndex, powerRaw, plausibleReadings.powerW, 'W');

  if (errors.isEmpty && vrm.every((channel) => channel.valuesC.every((value) => value !== value))) {
    errors.add(
      null,
      vrm.map((channel) => channel.column).join(', '),
      'no-numeric-data',
      'The VRM columns hold no readings: every cell is blank or an error marker.',
    );
  }
  if (!errors.isEmpty) return { ok: false, errors: errors.list() };

  return {
    ok: true,
    log: {
      timeS,
      startedAt,
      timeColumn: columns[timeIndex],
      timeFormat: time.format,
      rowNumbers,
      vrm,
      ambient,
      clockMHz,
      powerW,
      readNotes: repeated ? [repeatedStampsNote(repeated)] : [],
    },
  };
}
