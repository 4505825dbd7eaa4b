import type { AnalysisOptions, ColumnMapping, ParseError, TemperatureUnit, TimeFormat } from '../schemas/analysis';
import { isNumericSentinel, readCell, readPlainDecimal } from './log-cell-value';
import { guessColumnRole, unitFromColumnName } from './log-column-guess';
import { createTimeReader, detectDayFirst, detectTimeFormat, readDateTime } from './log-time-value';
import type { LoggerTable } from './logger-table';
import { ParseErrorList, cellLabel } from './parse-error-list';
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

function readTimeColumn(
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

interface RawColumn {
  values: Float64Array;
  suffixUnit: TemperatureUnit | null;
  suffixRow: number | null;
}

function readRawColumn(table: LoggerTable, index: number, errors: ParseErrorList): RawColumn {
  const { rows, rowNumbers, decimalComma } = table;
  const column = table.columns[index];
  const values = new Float64Array(rows.length);
  let suffixUnit: TemperatureUnit | null = null;
  let suffixRow: number | null = null;
  for (let i = 0; i < rows.length; i++) {
    const cell = rows[i][index];
    if (cell === undefined || cell === '') {
      values[i] = Number.NaN;
      continue;
    }
    const plain = readPlainDecimal(cell, decimalComma);
    if (plain === plain) {
      values[i] = plain;
      continue;
    }
    const reading = readCell(cell, decimalComma);
    values[i] = Number.NaN;
    if (reading.kind === 'gap') continue;
    if (reading.kind === 'invalid') {
      const example = decimalComma ? '45,2 (decimal comma)' : '45.2';
      errors.add(
        rowNumbers[i],
        column,
        'not-a-number',
        `${cellLabel(rowNumbers[i], column)}: "${cell.trim()}" is not a number. Expected a number such as ${example}, a blank cell or an error marker such as OPEN, ERR or ----.`,
      );
      continue;
    }
    values[i] = reading.value;
    if (reading.unit === null) continue;
    if (suffixUnit === null) {
      suffixUnit = reading.unit;
      suffixRow = rowNumbers[i];
    } else if (reading.unit !== suffixUnit) {
      errors.add(
        rowNumbers[i],
        column,
        'mixed-units',
        `${cellLabel(rowNumbers[i], column)}: the value is in ${temperatureUnitLabels[reading.unit]}, but row ${suffixRow} of the same column is in ${temperatureUnitLabels[suffixUnit]}. Export one unit per column.`,
      );
    }
  }
  return { values, suffixUnit, suffixRow };
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
  i: number,
  index: number,
  errors: ParseErrorList,
  described: string,
  expected: string,
): void {
  const row = table.rowNumbers[i];
  const column = table.columns[index];
  errors.add(
    row,
    column,
    'absurd-value',
    `${cellLabel(row, column)}: ${described} is not a plausible reading (expected ${expected}). Check the unit and the column, or mark faulty samples with OPEN, ERR or ----.`,
  );
}

const temperatureRangeText = `${plausibleReadings.temperatureC.min}…${plausibleReadings.temperatureC.max} °C`;

function toCelsius(
  table: LoggerTable,
  index: number,
  raw: Float64Array,
  unit: TemperatureUnit,
  coldJunctionC: Float64Array | number | null,
  errors: ParseErrorList,
): Float64Array {
  const { min, max } = plausibleReadings.temperatureC;
  const out = new Float64Array(raw.length);
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
        if (isNumericSentinel(table.rows[i][index])) {
          out[i] = Number.NaN;
          continue;
        }
        absurd(
          table,
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
      if (!isNumericSentinel(table.rows[i][index])) {
        absurd(table, i, index, errors, `${value} ${temperatureUnitLabels[unit]}`, temperatureRangeText);
      }
      continue;
    }
    out[i] = celsius;
  }
  return out;
}

function checkRange(
  table: LoggerTable,
  index: number,
  values: Float64Array,
  range: { min: number; max: number },
  unitLabel: string,
  errors: ParseErrorList,
): void {
  for (let i = 0; i < values.length; i++) {
    const value = values[i];
    if (value !== value || (value >= range.min && value <= range.max)) continue;
    values[i] = Number.NaN;
    if (isNumericSentinel(table.rows[i][index])) continue;
    absurd(table, i, index, errors, `${value} ${unitLabel}`, `${range.min}…${range.max} ${unitLabel}`);
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

  if (table.rows.length < 2) {
    errors.add(
      table.rowNumbers[0] ?? table.headerRow,
      null,
      'too-few-rows',
      'The log has fewer than two data rows; a soak needs a series of readings.',
    );
  }
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

  const time = readTimeColumn(table, timeIndex, errors);
  if (!time) return { ok: false, errors: errors.list() };

  let junctionC: Float64Array | number | null = junction && 'fixedC' in junction ? junction.fixedC : null;
  if (junctionIndex !== null) {
    const column = columns[junctionIndex];
    const raw = readRawColumn(table, junctionIndex, errors);
    const unit = resolveUnit(table, column, raw, mappedUnit(mapping, column), 'C', errors);
    if (unit === 'mV') {
      errors.add(
        table.headerRow,
        column,
        'mixed-units',
        `${cellLabel(null, column)}: a cold junction is a temperature, not millivolts.`,
      );
    } else {
      junctionC = toCelsius(table, junctionIndex, raw.values, unit, null, errors);
    }
  }

  const readTemperature = (index: number): MappedTemperatureChannel => {
    const column = columns[index];
    const raw = readRawColumn(table, index, errors);
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
    return { column, unit, valuesC: toCelsius(table, index, raw.values, unit, junctionC, errors) };
  };

  const vrm = (vrmIndexes as number[]).map(readTemperature);
  const ambient = ambientIndex === null ? null : readTemperature(ambientIndex);

  let clockMHz: MappedSeries | null = null;
  if (clockIndex !== null) {
    const column = columns[clockIndex];
    const values = readRawColumn(table, clockIndex, errors).values;
    if (/\bghz\b/i.test(column)) for (let i = 0; i < values.length; i++) values[i] *= 1000;
    checkRange(table, clockIndex, values, plausibleReadings.clockMHz, 'MHz', errors);
    clockMHz = { column, values };
  }
  let powerW: MappedSeries | null = null;
  if (powerIndex !== null) {
    const column = columns[powerIndex];
    const values = readRawColumn(table, powerIndex, errors).values;
    checkRange(table, powerIndex, values, plausibleReadings.powerW, 'W', errors);
    powerW = { column, values };
  }

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
      timeS: time.timeS,
      startedAt: time.startedAt,
      timeColumn: columns[timeIndex],
      timeFormat: time.format,
      rowNumbers: table.rowNumbers,
      vrm,
      ambient,
      clockMHz,
      powerW,
    },
  };
}
