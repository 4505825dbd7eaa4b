import { afterEach, describe, expect, it } from 'vitest';
import { formatCalendarDate, formatClockTime, formatInstant, formatSlot } from '../../src/lib/format-time';

// Expected strings follow CLDR's formats for each locale as ICU ships them with Node 20 (en-GB: 24-hour clock, day
// before month; en-US: 12-hour clock with AM/PM, month before day; de-DE: 24-hour, "14.12.2026"). Unicode CLDR, the
// locale data behind Intl.DateTimeFormat.
function useLocale(...languages: string[]) {
  Object.defineProperty(window.navigator, 'languages', { value: languages, configurable: true });
}

afterEach(() => useLocale('en-GB'));

/** ICU writes a narrow no-break space before AM/PM in some versions and a plain one in others. */
const spaced = (text: string) => text.replace(/[\u202f\u00a0]/g, ' ');

describe('times and dates in the user’s locale', () => {
  const afternoon = new Date(2026, 2, 2, 14, 5);

  it('writes a 24-hour clock where the locale uses one and AM/PM where it does not', () => {
    useLocale('en-GB');
    expect(spaced(formatClockTime(afternoon))).toBe('14:05');
    useLocale('en-US');
    expect(spaced(formatClockTime(afternoon))).toBe('2:05 PM');
    useLocale('de-DE');
    expect(spaced(formatClockTime(afternoon))).toBe('14:05');
  });

  it('writes calendar dates in the locale’s order, without any zone shift', () => {
    useLocale('en-GB');
    expect(spaced(formatCalendarDate('2026-12-14'))).toBe('14 Dec 2026');
    useLocale('en-US');
    expect(spaced(formatCalendarDate('2026-12-14'))).toBe('Dec 14, 2026');
    useLocale('de-DE');
    expect(spaced(formatCalendarDate('2026-12-14'))).toBe('14.12.2026');
  });

  it('instants and slots follow the same locale', () => {
    const start = new Date(2026, 11, 1, 9, 0).toISOString();
    const end = new Date(2026, 11, 1, 13, 0).toISOString();
    useLocale('en-GB');
    expect(spaced(formatSlot(start, end, { withDay: false }))).toBe('09:00 – 13:00');
    expect(spaced(formatInstant(start))).toBe('1 Dec 2026, 09:00');
    useLocale('en-US');
    expect(spaced(formatSlot(start, end, { withDay: false }))).toBe('9:00 AM – 1:00 PM');
    expect(spaced(formatInstant(start))).toBe('Dec 1, 2026, 9:00 AM');
  });
});
