import { z } from 'zod';

/**
 * Calendar dates and instants as requests carry them, each kind of field with the range of years that can be
 * true for it. A date outside its range is refused with the range in words, so a mistyped year (0205, 9999)
 * never reaches the database, and no year is read through `Date.UTC`/`new Date(y, …)`, which map years 0–99
 * to 1900–1999.
 *
 * The ranges are plausibility bounds, common practice, no source: the product line started well after 1990,
 * prices are recorded for current products, and planning and bookings are for the present era.
 */
export interface YearRange {
  fromYear: number;
  toYear: number;
}

export const dateRanges = {
  /** A product's release date. */
  release: { fromYear: 1990, toYear: 2100 },
  /** The day a price was observed. */
  priceObserved: { fromYear: 2000, toYear: 2100 },
  /** Planning dates: target publish dates, due dates, loan return-by, received and returned dates. */
  planning: { fromYear: 2000, toYear: 2100 },
  /** Bench bookings and calendar windows (UTC instants). */
  booking: { fromYear: 2000, toYear: 2100 },
} as const satisfies Record<string, YearRange>;

const datePattern = /^(\d{4})-(\d{2})-(\d{2})$/;

function daysInMonth(year: number, month: number): number {
  if (month === 2) return year % 4 === 0 && (year % 100 !== 0 || year % 400 === 0) ? 29 : 28;
  return [4, 6, 9, 11].includes(month) ? 30 : 31;
}

/** Why the text is not a calendar date YYYY-MM-DD within the range; null when it is. Pure string arithmetic. */
export function calendarDateProblem(text: string, range: YearRange): string | null {
  const match = datePattern.exec(text);
  if (!match) return 'Enter a date as YYYY-MM-DD.';
  const [year, month, day] = [Number(match[1]), Number(match[2]), Number(match[3])];
  if (month < 1 || month > 12 || day < 1 || day > daysInMonth(year, month)) return 'This day does not exist.';
  if (year < range.fromYear || year > range.toYear) {
    return `Enter a date from ${range.fromYear}-01-01 to ${range.toYear}-12-31.`;
  }
  return null;
}

/** Text that `problemOf` accepts (it says what is wrong, or null), described in the API document as `format`. */
function checkedText(problemOf: (text: string, range: YearRange) => string | null, range: YearRange, format: string) {
  return z
    .string()
    .check((payload) => {
      const problem = problemOf(payload.value, range);
      if (problem) payload.issues.push({ code: 'custom', message: problem, input: payload.value });
    })
    .meta({ format, 'x-year-range': [range.fromYear, range.toYear] });
}

/** A calendar date (no time, no zone) YYYY-MM-DD, with a plausible year for the kind of field. */
export function calendarDate(range: YearRange) {
  return checkedText(calendarDateProblem, range, 'date');
}

export const releaseDateSchema = calendarDate(dateRanges.release);
export const priceObservedDateSchema = calendarDate(dateRanges.priceObserved);
export const planningDateSchema = calendarDate(dateRanges.planning);

/** ISO 8601 date and time with its zone (Z or ±hh:mm), as typed; the API answers in UTC. */
const zonedInstantPattern =
  /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})(?::(\d{2})(?:\.(\d{1,9}))?)?(Z|[+-]\d{2}:\d{2})$/i;

/**
 * Why the text is not an instant with an explicit zone whose UTC moment lies within the range; null when fine.
 * The range is judged on the UTC instant, so 9999-12-31T23:00-05:00 (year 10000 in UTC) is refused too.
 */
export function zonedInstantProblem(text: string, range: YearRange): string | null {
  const example = `e.g. ${Math.max(range.fromYear, 2025)}-06-02T09:00:00+02:00`;
  const match = zonedInstantPattern.exec(text);
  if (!match) return `Enter a date and time with its zone, ${example}.`;
  const [year, month, day, hour, minute, second] = match.slice(1, 7).map((part) => Number(part ?? 0));
  if (month < 1 || month > 12 || day < 1 || day > daysInMonth(year, month)) return 'This day does not exist.';
  if (hour > 23 || minute > 59 || second > 59) return 'This time of day does not exist.';
  const zone = match[8].toUpperCase();
  if (zone !== 'Z') {
    const [zoneHours, zoneMinutes] = zone.slice(1).split(':').map(Number);
    if (zoneHours > 14 || zoneMinutes > 59) return `This zone offset does not exist; ${example}.`;
  }
  const ms = Date.parse(text);
  const first = Date.UTC(range.fromYear, 0, 1);
  // Date.UTC(year + 1, 0, 1) is safe here: the ranges' years are far above 99.
  const afterLast = Date.UTC(range.toYear + 1, 0, 1);
  if (!Number.isFinite(ms) || ms < first || ms >= afterLast) {
    return `Enter a time from ${range.fromYear}-01-01 to ${range.toYear}-12-31 (UTC).`;
  }
  return null;
}

/** An instant with an explicit zone, within the range once converted to UTC. */
export function zonedInstant(range: YearRange) {
  return checkedText(zonedInstantProblem, range, 'date-time');
}

export const bookingInstantSchema = zonedInstant(dateRanges.booking);

/** Today's calendar date (YYYY-MM-DD) in an IANA time zone. */
export function todayIn(timeZone: string, now: Date = new Date()): string {
  // en-CA formats dates as YYYY-MM-DD.
  return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(now);
}
