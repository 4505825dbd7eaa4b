import { describe, expect, it } from 'vitest';
import type { AnalysisRequestInput, ParseError } from '../../../shared/schemas/analysis';
import { analyseLog } from '../../../shared/domain/analysis/analyse-log';

function errorsOf(text: string, request: AnalysisRequestInput = { mapping: { vrm: ['VRM 1'] } }): ParseError[] {
  const outcome = analyseLog(text, request);
  if (outcome.ok) throw new Error('expected the upload to be refused');
  return outcome.errors;
}

interface OneError {
  title: string;
  text: string;
  request?: AnalysisRequestInput;
  expected: Partial<ParseError>;
  /** Words the message must carry, where the case names them. */
  says?: string;
}

const oneErrorCases: OneError[] = [
  {
    title: 'when the file has numbers but no header row, then it asks for one',
    text: '0,50\n1,51\n2,52\n',
    expected: { row: 1, code: 'no-header' },
  },
  {
    title: 'when a time cell cannot be read, then the row and column are named',
    text: 'Time,VRM 1\n0,50\n1,51\nlater,52\n',
    expected: { row: 4, column: 'Time', code: 'unparseable-time' },
    says: '"later" is not a time',
  },
  {
    title: 'when the first time cell is no time at all, then the upload is refused at that row',
    text: 'Time,VRM 1\nsoon,50\n1,51\n',
    request: { mapping: { time: 'Time', vrm: ['VRM 1'] } },
    expected: { row: 2, column: 'Time', code: 'unparseable-time' },
  },
  {
    title: 'when a reading is text, then the cell is named with what was expected',
    text: 'Time,VRM 1\n0,50\n1,hot\n',
    expected: { row: 3, column: 'VRM 1', code: 'not-a-number' },
    says: 'Expected a number such as 45.2',
  },
  {
    title: 'when one column mixes °C and °F, then the upload is refused as mixed units',
    text: 'Time,VRM 1\n0,50 °C\n1,122 °F\n',
    expected: { row: 3, column: 'VRM 1', code: 'mixed-units' },
  },
  {
    title: 'when the header says °F but the mapping says °C, then the upload is refused as mixed units',
    text: 'Time,VRM 1 [°F]\n0,122\n1,123\n',
    request: { mapping: { vrm: ['VRM 1 [°F]'], units: { 'VRM 1 [°F]': 'C' } } },
    expected: { row: 1, code: 'mixed-units' },
  },
  {
    title: 'when a reading is absurd, then the cell is named with the plausible range',
    text: 'Time,VRM 1\n0,50\n1,812.4\n',
    expected: { row: 3, column: 'VRM 1', code: 'absurd-value' },
    says: 'expected -50…250 °C',
  },
  {
    title: 'when raw millivolts are beyond the type K range, then the cell is named',
    text: 'Time,TC1 (mV)\n0,2.1\n1,61.5\n',
    request: { mapping: { vrm: ['TC1 (mV)'] }, options: { coldJunction: { fixedC: 25 } } },
    expected: { row: 3, column: 'TC1 (mV)', code: 'absurd-value' },
  },
  {
    title: 'when raw millivolts come without a cold junction, then it asks for one',
    text: 'Time,TC1 (mV)\n0,2.1\n1,2.2\n',
    request: { mapping: { vrm: ['TC1 (mV)'] } },
    expected: { column: 'TC1 (mV)', code: 'cold-junction-missing' },
  },
  {
    title: 'when a row has more cells than the header, then the row is named',
    text: 'Time,VRM 1\n0,50\n1,51,99\n',
    expected: { row: 3, code: 'extra-cells' },
  },
  {
    title: 'when the mapping names a column the file lacks, then the columns are listed',
    text: 'Time,VRM 1\n0,50\n1,51\n',
    request: { mapping: { vrm: ['VRM 9'] } },
    expected: { row: 1, column: 'VRM 9', code: 'unknown-column' },
    says: 'Columns: Time, VRM 1',
  },
  {
    title: 'when every VRM cell is an error marker, then there is no numeric data',
    text: 'Time,VRM 1\n0,OPEN\n1,OPEN\n',
    expected: { column: 'VRM 1', code: 'no-numeric-data' },
  },
];

describe('bad uploads get a precise error, not a crash', () => {
  it.each(oneErrorCases)('$title', ({ text, request, expected, says }) => {
    const [error] = errorsOf(text, request);
    expect(error).toMatchObject(expected);
    if (says) expect(error.message).toContain(says);
  });

  it('when a tester uploads an empty file, then it is refused as empty', () => {
    expect(errorsOf('')).toEqual([{ row: null, column: null, code: 'empty-file', message: 'The file is empty.' }]);
    expect(errorsOf(' \n\n')[0].code).toBe('empty-file');
  });

  it('when the file has a header but no numeric rows, then it says so', () => {
    const [error] = errorsOf('Time,VRM 1\n');
    expect(error.code).toBe('no-numeric-data');
    expect(errorsOf('Time,VRM 1\nstart,warm\n')[0].code).toBe('no-numeric-data');
  });

  it('when time goes backwards or repeats, then the upload is refused at that row', () => {
    const [backwards] = errorsOf('Time,VRM 1\n0,50\n2,51\n1,52\n');
    expect(backwards).toMatchObject({ row: 4, column: 'Time', code: 'non-monotonic-time' });
    expect(backwards.message).toContain('earlier than the row before');
    const [repeat] = errorsOf('Time,VRM 1\n0,50\n1,51\n1,52\n');
    expect(repeat).toMatchObject({ row: 4, code: 'non-monotonic-time' });
  });

  it('when no VRM column can be guessed, then the tester is asked to choose', () => {
    const outcome = analyseLog('Time,Ambient\n0,21\n1,21\n', {});
    expect(outcome.ok).toBe(false);
    if (!outcome.ok) {
      expect(outcome.errors[0].code).toBe('mapping-incomplete');
      expect(outcome.preview?.columns.map((column) => column.name)).toEqual(['Time', 'Ambient']);
    }
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
