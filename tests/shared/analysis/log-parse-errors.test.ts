import { describe, expect, it } from 'vitest';
import type { AnalysisRequestInput, ParseError } from '../../../shared/schemas/analysis';
import { analyseLog } from '../../../shared/domain/analysis/analyse-log';

function errorsOf(text: string, request: AnalysisRequestInput = { mapping: { vrm: ['VRM 1'] } }): ParseError[] {
  const outcome = analyseLog(text, request);
  if (outcome.ok) throw new Error('expected the upload to be refused');
  return outcome.errors;
}

describe('bad uploads get a precise error, not a crash', () => {
  it('when a tester uploads an empty file, then it is refused as empty', () => {
    expect(errorsOf('')).toEqual([{ row: null, column: null, code: 'empty-file', message: 'The file is empty.' }]);
    expect(errorsOf(' \n\n')[0].code).toBe('empty-file');
  });

  it('when the file has a header but no numeric rows, then it says so', () => {
    const [error] = errorsOf('Time,VRM 1\n');
    expect(error.code).toBe('no-numeric-data');
    expect(errorsOf('Time,VRM 1\nstart,warm\n')[0].code).toBe('no-numeric-data');
  });

  it('when the file has numbers but no header row, then it asks for one', () => {
    const [error] = errorsOf('0,50\n1,51\n2,52\n');
    expect(error).toMatchObject({ row: 1, code: 'no-header' });
  });

  it('when a time cell cannot be read, then the row and column are named', () => {
    const [error] = errorsOf('Time,VRM 1\n0,50\n1,51\nlater,52\n');
    expect(error).toMatchObject({ row: 4, column: 'Time', code: 'unparseable-time' });
    expect(error.message).toContain('"later" is not a time');
  });

  it('when the first time cell is no time at all, then the upload is refused at that row', () => {
    const [error] = errorsOf('Time,VRM 1\nsoon,50\n1,51\n', { mapping: { time: 'Time', vrm: ['VRM 1'] } });
    expect(error).toMatchObject({ row: 2, column: 'Time', code: 'unparseable-time' });
  });

  it('when time goes backwards or repeats, then the upload is refused at that row', () => {
    const [backwards] = errorsOf('Time,VRM 1\n0,50\n2,51\n1,52\n');
    expect(backwards).toMatchObject({ row: 4, column: 'Time', code: 'non-monotonic-time' });
    expect(backwards.message).toContain('earlier than the row before');
    const [repeat] = errorsOf('Time,VRM 1\n0,50\n1,51\n1,52\n');
    expect(repeat).toMatchObject({ row: 4, code: 'non-monotonic-time' });
  });

  it('when a reading is text, then the cell is named with what was expected', () => {
    const [error] = errorsOf('Time,VRM 1\n0,50\n1,hot\n');
    expect(error).toMatchObject({ row: 3, column: 'VRM 1', code: 'not-a-number' });
    expect(error.message).toContain('Expected a number such as 45.2');
  });

  it('when one column mixes °C and °F, then the upload is refused as mixed units', () => {
    const [error] = errorsOf('Time,VRM 1\n0,50 °C\n1,122 °F\n');
    expect(error).toMatchObject({ row: 3, column: 'VRM 1', code: 'mixed-units' });
  });

  it('when the header says °F but the mapping says °C, then the upload is refused as mixed units', () => {
    const [error] = errorsOf('Time,VRM 1 [°F]\n0,122\n1,123\n', {
      mapping: { vrm: ['VRM 1 [°F]'], units: { 'VRM 1 [°F]': 'C' } },
    });
    expect(error).toMatchObject({ row: 1, code: 'mixed-units' });
  });

  it('when a reading is absurd, then the cell is named with the plausible range', () => {
    const [error] = errorsOf('Time,VRM 1\n0,50\n1,812.4\n');
    expect(error).toMatchObject({ row: 3, column: 'VRM 1', code: 'absurd-value' });
    expect(error.message).toContain('expected -50…250 °C');
  });

  it('when raw millivolts are beyond the type K range, then the cell is named', () => {
    const [error] = errorsOf('Time,TC1 (mV)\n0,2.1\n1,61.5\n', {
      mapping: { vrm: ['TC1 (mV)'] },
      options: { coldJunction: { fixedC: 25 } },
    });
    expect(error).toMatchObject({ row: 3, column: 'TC1 (mV)', code: 'absurd-value' });
  });

  it('when raw millivolts come without a cold junction, then it asks for one', () => {
    const [error] = errorsOf('Time,TC1 (mV)\n0,2.1\n1,2.2\n', { mapping: { vrm: ['TC1 (mV)'] } });
    expect(error).toMatchObject({ column: 'TC1 (mV)', code: 'cold-junction-missing' });
  });

  it('when a row has more cells than the header, then the row is named', () => {
    const [error] = errorsOf('Time,VRM 1\n0,50\n1,51,99\n');
    expect(error).toMatchObject({ row: 3, code: 'extra-cells' });
  });

  it('when the mapping names a column the file lacks, then the columns are listed', () => {
    const [error] = errorsOf('Time,VRM 1\n0,50\n1,51\n', { mapping: { vrm: ['VRM 9'] } });
    expect(error).toMatchObject({ row: 1, column: 'VRM 9', code: 'unknown-column' });
    expect(error.message).toContain('Columns: Time, VRM 1');
  });

  it('when no VRM column can be guessed, then the tester is asked to choose', () => {
    const outcome = analyseLog('Time,Ambient\n0,21\n1,21\n', {});
    expect(outcome.ok).toBe(false);
    if (!outcome.ok) {
      expect(outcome.errors[0].code).toBe('mapping-incomplete');
      expect(outcome.preview?.columns.map((column) => column.name)).toEqual(['Time', 'Ambient']);
    }
  });

  it('when every VRM cell is an error marker, then there is no numeric data', () => {
    const [error] = errorsOf('Time,VRM 1\n0,OPEN\n1,OPEN\n');
    expect(error).toMatchObject({ column: 'VRM 1', code: 'no-numeric-data' });
  });

  it('when the log has a single row, then it is too short to analyse', () => {
    expect(errorsOf('Time,VRM 1\n0,50\n').map((error) => error.code)).toContain('too-few-rows');
  });

  it('when a bad cell sits deep in a large log, then its row number is still exact', () => {
    // Over a megabyte, so the rows are streamed in several chunks; two blank lines shift the numbering.
    const lines = ['Benchwire bench log', 'Time,VRM 1,VRM 2,VRM 3,Ambient'];
    for (let t = 0; t < 40_000; t++) {
      lines.push(t === 31_000 ? `${t},55.25,bad,54.75,21.00` : `${t},55.25,56.50,54.75,21.00`);
      if (t === 100 || t === 20_000) lines.push('');
    }
    const text = lines.join('\n');
    expect(text.length).toBeGreaterThan(1_000_000);
    const [error] = errorsOf(text, { mapping: { vrm: ['VRM 1', 'VRM 2', 'VRM 3'], ambient: 'Ambient' } });
    // Line of t = 31 000: 2 lines before the data, 31 000 rows before it, 2 blank lines, 1-based.
    expect(error).toMatchObject({ row: 2 + 31_000 + 2 + 1, column: 'VRM 2', code: 'not-a-number' });
  });

  it('when a whole column is garbage, then fifty errors are listed and the rest counted', () => {
    const rows = Array.from({ length: 80 }, (_, t) => `${t},bad`);
    const errors = errorsOf(['Time,VRM 1', ...rows].join('\n'));
    expect(errors).toHaveLength(51);
    expect(errors[50]).toMatchObject({
      code: 'too-many-errors',
      message: '30 more error(s) not listed; fix the ones above first.',
    });
  });
});
