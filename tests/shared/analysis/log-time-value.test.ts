import { describe, expect, it } from 'vitest';
import {
  createTimeReader,
  detectDayFirst,
  detectTimeFormat,
  readClockTime,
  readDateTime,
} from '../../../shared/domain/analysis/log-time-value';

describe('reading the time column', () => {
  it('recognises elapsed seconds, milliseconds and minutes by the header', () => {
    expect(detectTimeFormat('12.5', 'Time [s]')).toBe('seconds');
    expect(detectTimeFormat('12500', 'Time (ms)')).toBe('milliseconds');
    expect(detectTimeFormat('1,5', 'Elapsed min')).toBe('minutes');
    expect(createTimeReader({ format: 'milliseconds', decimalComma: false, dayFirst: true })('12500')).toBe(12.5);
    expect(createTimeReader({ format: 'minutes', decimalComma: true, dayFirst: true })('1,5')).toBe(90);
  });

  it('reads mm:ss and hh:mm:ss, with fractions and am/pm (first principles)', () => {
    expect(detectTimeFormat('01:02:03', 'Time')).toBe('clock');
    expect(readClockTime('01:02:03')).toBe(3723);
    expect(readClockTime('62:03')).toBe(3723);
    expect(readClockTime('00:00:01.5')).toBe(1.5);
    expect(readClockTime('00:00:01,5')).toBe(1.5);
    expect(readClockTime('12:00:10 AM')).toBe(10);
    expect(readClockTime('1:00:00 pm')).toBe(13 * 3600);
    expect(readClockTime('00:61:00')).toBeNaN();
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

  it('decides day-first or month-first from the stamps themselves', () => {
    expect(detectDayFirst(['13/03/2025 09:00:00'])).toBe(true);
    expect(detectDayFirst(['03/13/2025 09:00:00'])).toBe(false);
    expect(detectDayFirst(['01.03.2025 09:00:00'])).toBe(true);
    expect(detectDayFirst(['03/01/2025 09:00:00'])).toBe(false);
  });

  it('refuses text that is no time', () => {
    expect(detectTimeFormat('soon', 'Time')).toBeNull();
    expect(createTimeReader({ format: 'seconds', decimalComma: false, dayFirst: true })('n/a')).toBeNaN();
  });
});
