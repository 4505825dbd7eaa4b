import { describe, expect, it } from 'vitest';
import { parseLoggerTable, type LoggerTable } from '../../../shared/domain/analysis/logger-table';
import { readMappedLog } from '../../../shared/domain/analysis/read-mapped-log';
import { syntheticLoggerLog } from '../../../shared/generators/synthetic-logger-log';
import { typeKMeasuredMillivolts } from '../../../shared/domain/analysis/type-k-thermocouple';

function table(text: string): LoggerTable {
  const parsed = parseLoggerTable(text);
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.errors));
  return parsed.table;
}

describe('logger import: the shapes loggers write', () => {
  it('when a logger writes a preamble before the header, then the preamble is kept aside and rows keep their file line numbers', () => {
    const text = [
      'Benchwire bench logger v2',
      'Start: 2025-03-01 09:00',
      '',
      'Time;VRM 1;Ambient',
      '0;40,5;21,0',
      '1;40,7;21,1',
      '',
    ].join('\n');
    const result = table(text);
    expect(result.preambleLines).toEqual(['Benchwire bench logger v2', 'Start: 2025-03-01 09:00']);
    expect(result.headerRow).toBe(4);
    expect(result.delimiter).toBe(';');
    expect(result.decimalComma).toBe(true);
    expect(result.firstRowNumber).toBe(5);
    const mapped = readMappedLog(result, { vrm: ['VRM 1'] }, {});
    expect(mapped.ok && Array.from(mapped.log.rowNumbers)).toEqual([5, 6]);
  });

  it.each([
    [',', false],
    [';', false],
    ['\t', false],
    [';', true],
    ['\t', true],
  ] as const)('reads delimiter %j with decimal comma %s', (delimiter, decimalComma) => {
    const text = syntheticLoggerLog({
      durationS: 5,
      sampleHz: 1,
      delimiter,
      decimalComma,
      probes: [{ name: 'VRM 1', startC: 40.25, riseC: 0, tauS: 1 }],
      ambient: { name: 'Ambient', startC: 21.5 },
    });
    const parsed = table(text);
    expect(parsed.delimiter).toBe(delimiter);
    expect(parsed.decimalComma).toBe(decimalComma);
    const mapped = readMappedLog(parsed, { vrm: ['VRM 1 [°C]'], ambient: 'Ambient [°C]' }, {});
    expect(mapped.ok && Array.from(mapped.log.vrm[0].valuesC)).toEqual([40.25, 40.25, 40.25, 40.25, 40.25]);
    expect(mapped.ok && mapped.log.ambient?.valuesC[0]).toBe(21.5);
  });

  it.each(['seconds', 'clock', 'iso'] as const)('reads a %s time column as seconds from the first sample', (time) => {
    const text = syntheticLoggerLog({
      durationS: 4,
      sampleHz: 2,
      time,
      probes: [{ name: 'VRM 1', startC: 50, riseC: 0, tauS: 1 }],
    });
    const mapped = readMappedLog(table(text), { vrm: ['VRM 1 [°C]'] }, {});
    expect(mapped.ok && Array.from(mapped.log.timeS)).toEqual([0, 0.5, 1, 1.5, 2, 2.5, 3, 3.5]);
  });

  it('keeps the start instant of zoned ISO stamps as UTC, and maps a column by its position', () => {
    const text = syntheticLoggerLog({
      durationS: 2,
      sampleHz: 1,
      time: 'iso',
      startIso: '2025-03-01T08:30:00Z',
      probes: [{ name: 'VRM 1', startC: 50, riseC: 0, tauS: 1 }],
    });
    const mapped = readMappedLog(table(text), { vrm: ['2'] }, {}); // by position: column 2
    expect(mapped.ok && mapped.log.startedAt).toBe('2025-03-01T08:30:00.000Z');
  });

  it('reads local day-first date-time stamps and a time of day that passes midnight', () => {
    const text = ['Date/Time,VRM 1', '01.03.2025 23:59:59,50', '02.03.2025 00:00:00,51'].join('\n');
    const mapped = readMappedLog(table(text), { vrm: ['VRM 1'] }, {});
    expect(mapped.ok && Array.from(mapped.log.timeS)).toEqual([0, 1]);
    const clock = ['Time,VRM 1', '23:59:59,50', '00:00:01,51'].join('\n');
    const wrapped = readMappedLog(table(clock), { vrm: ['VRM 1'] }, {});
    expect(wrapped.ok && Array.from(wrapped.log.timeS)).toEqual([0, 2]);
  });

  it('converts °F and K channels to °C (ITS-90 definitions, first principles)', () => {
    const text = ['Time,VRM 1 [°F],VRM 2 [K],Ambient', '0,212,373.15,21', '1,212,373.15,21'].join('\n');
    const mapped = readMappedLog(table(text), { vrm: ['VRM 1 [°F]', 'VRM 2 [K]'], ambient: 'Ambient' }, {});
    expect(mapped.ok).toBe(true);
    if (!mapped.ok) return;
    expect(mapped.log.vrm[0].valuesC[0]).toBeCloseTo(100, 10);
    expect(mapped.log.vrm[1].valuesC[0]).toBeCloseTo(100, 10);
    expect(mapped.log.vrm.map((channel) => channel.unit)).toEqual(['F', 'K']);
  });

  it('converts a column mapped to two roles once for each role', () => {
    const text = ['Time,Probe [°F]', '0,212', '1,212'].join('\n');
    const mapped = readMappedLog(table(text), { vrm: ['Probe [°F]'], ambient: 'Probe [°F]' }, {});
    expect(mapped.ok && [mapped.log.vrm[0].valuesC[0], mapped.log.ambient?.valuesC[0]]).toEqual([100, 100]);
  });

  it('takes the unit from the mapping or the upload options when the header names none', () => {
    const text = ['Time,CH1,CH2', '0,212,50', '1,212,50'].join('\n');
    const mapped = readMappedLog(table(text), { vrm: ['CH1', 'CH2'], units: { ch1: 'F' } }, { unit: 'C' });
    expect(mapped.ok && [mapped.log.vrm[0].valuesC[0], mapped.log.vrm[1].valuesC[0]]).toEqual([100, 50]);
  });

  it('reads cells that carry their own unit', () => {
    const text = ['Time,VRM 1', '0,50.0 °C', '1,51.0 °C'].join('\n');
    const mapped = readMappedLog(table(text), { vrm: ['VRM 1'] }, {});
    expect(mapped.ok && Array.from(mapped.log.vrm[0].valuesC)).toEqual([50, 51]);
  });

  it('converts raw type K millivolts with a fixed cold junction (first principles from NIST SRD 60)', () => {
    const text = syntheticLoggerLog({
      durationS: 3,
      sampleHz: 1,
      unit: 'mV',
      coldJunctionC: 25,
      probes: [{ name: 'TC1', startC: 100, riseC: 0, tauS: 1 }],
    });
    const mapped = readMappedLog(table(text), { vrm: ['TC1 [mV]'] }, { coldJunction: { fixedC: 25 } });
    expect(mapped.ok).toBe(true);
    // The file holds E(100) − E(25) rounded to 0.001 mV; 0.0005 mV is about 0.012 °C at 100 °C.
    if (mapped.ok) expect(mapped.log.vrm[0].valuesC[0]).toBeCloseTo(100, 1);
  });

  it('converts raw millivolts with the cold junction from a logged channel, sample by sample', () => {
    const rows = [0, 1, 2].map((t) => {
      const junctionC = 24 + t;
      return `${t},${typeKMeasuredMillivolts(90, junctionC).toFixed(4)},${junctionC}`;
    });
    const text = ['Time,TC1 (mV),CJC', ...rows].join('\n');
    const mapped = readMappedLog(table(text), { vrm: ['TC1 (mV)'] }, { coldJunction: { column: 'CJC' } });
    expect(mapped.ok).toBe(true);
    if (mapped.ok) for (const value of mapped.log.vrm[0].valuesC) expect(value).toBeCloseTo(90, 1);
  });

  it('turns blank cells and error markers into gaps, not zeros', () => {
    const text = ['Time,VRM 1,VRM 2', '0,50,OPEN', '1,,ERR', '2,----,NaN', '3,-999.9,52'].join('\n');
    const mapped = readMappedLog(table(text), { vrm: ['VRM 1', 'VRM 2'] }, {});
    expect(mapped.ok).toBe(true);
    if (!mapped.ok) return;
    expect(Array.from(mapped.log.vrm[0].valuesC)).toEqual([50, NaN, NaN, NaN]);
    expect(Array.from(mapped.log.vrm[1].valuesC)).toEqual([NaN, NaN, NaN, 52]);
  });

  it('reads Windows line endings and a byte-order mark', () => {
    const text = '\ufeffTime,VRM 1\r\n0,50\r\n1,51\r\n';
    const mapped = readMappedLog(table(text), { vrm: ['VRM 1'] }, {});
    expect(mapped.ok && [Array.from(mapped.log.timeS), Array.from(mapped.log.vrm[0].valuesC)]).toEqual([
      [0, 1],
      [50, 51],
    ]);
  });

  it('reads a clock logged in GHz as MHz', () => {
    const text = ['Time,VRM 1,Clock GHz', '0,50,4.5', '1,50,4.4'].join('\n');
    const mapped = readMappedLog(table(text), { vrm: ['VRM 1'], clock: 'Clock GHz' }, {});
    expect(mapped.ok && Array.from(mapped.log.clockMHz?.values ?? [])).toEqual([4500, 4400]);
  });

  it('ignores a trailing delimiter and blank lines or delimiter-only lines between rows', () => {
    const text = 'Time,VRM 1,\n0,50,\n\n,,\n1,51,\n';
    const mapped = readMappedLog(table(text), { vrm: ['VRM 1'] }, {});
    expect(mapped.ok && Array.from(mapped.log.rowNumbers)).toEqual([2, 5]);
    expect(mapped.ok && Array.from(mapped.log.vrm[0].valuesC)).toEqual([50, 51]);
  });
});
