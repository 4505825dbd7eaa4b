import { describe, expect, it } from 'vitest';
import {
  createTimeReader,
  detectDayFirst,
  detectTimeFormat,
  readClockTime,
  readDateTime,
} from '../../../shared/domain/analysis/log-time-value';

describe('reading the time column', () => {
  it.each([
    ['12.5', 'Time [s]', 'seconds'],
    ['12500', 'Time (ms)', 'milliseconds'],
    ['1,5', 'Elapsed min', 'minutes'],
  ])(
    'recognises elapsed seconds, milliseconds and minutes by the header: %j under %j is %s',
    (text, header, format) => {
      expect(detectTimeFormat(text, header)).toBe(format);
    },
  );

  it('reads elapsed milliseconds and minutes as seconds', () => {
    expect(createTimeReader({ format: 'milliseconds', decimalComma: false, dayFirst: true })('12500')).toBe(12.5);
    expect(createTimeReader({ format: 'minutes', decimalComma: true, dayFirst: true })('1,5')).toBe(90);
  });

  it('recognises mm:ss and hh:mm:ss as clock times', () => {
    expect(detectTimeFormat('01:02:03', 'Time')).toBe('clock');
  });

  it.each([
    ['01:02:03', 3723],
    ['62:03', 3723],
    ['00:00:01.5', 1.5],
    ['00:00:01,5', 1.5],
    ['12:00:10 AM', 10],
    ['1:00:00 pm', 13 * 3600],
    ['00:61:00', Number.NaN],
  ])('reads mm:ss and hh:mm:ss, with fractions and am/pm (first principles): %s → %d s', (text, seconds) => {
    // toBe compares with Object.is, so an impossible time must give NaN itself.
    expect(readClockTime(text)).toBe(seconds);
  });

  it('reads ISO 8601 stamps with and without a zone, and local date-time stamps', () => {
    expect(detectTimeFormat('2025-03-01T09:00:00Z', 'Timestamp')).toBe('date-time');
    expect(readDateTime('2025-03-01T09:00:00Z', true)).toEqual({
      seconds: Date.UTC(2025, 2, 1, 9) / 1000,
      hasOffset: true,
    });
    expect(readDateTime('2025-03-01T10:00:00+01:00', true)?.seconds).toBe(Date.UTC(2025, 2, 1, 9) / 1000);
    expect(readDateTime('2025-03-01 09:00:00.250', true)).toEqual({
      seconds: Date.UTC(2025, 2, 1, 9) / 1000 + 0.25,
      hasOffset: false,
    });
    expect(readDateTime('01.03.2025 09:00:00', true)?.seconds).toBe(Date.UTC(2025, 2, 1, 9) / 1000);
    expect(readDateTime('03/01/2025 9:00:00 PM', false)?.seconds).toBe(Date.UTC(2025, 2, 1, 21) / 1000);
    expect(readDateTime('2025-13-01 09:00:00', true)).toBeNull();
  });

  it.each([
    ['13/03/2025 09:00:00', true],
    ['03/13/2025 09:00:00', false],
    ['01.03.2025 09:00:00', true],
    ['03/01/2025 09:00:00', false],
  ])('decides day-first or month-first from the stamps themselves: %s → day first %s', (stamp, dayFirst) => {
    expect(detectDayFirst([stamp])).toBe(dayFirst);
  });

  it('refuses text that is no time', () => {
    expect(detectTimeFormat('soon', 'Time')).toBeNull();
    expect(createTimeReader({ format: 'seconds', decimalComma: false, dayFirst: true })('n/a')).toBeNaN();
  });
});
