// Bookings are UTC instants; the booking screens show them in the zone of the device, and name that zone. Calendar
// arithmetic and the datetime-local fields live here; slots are written out by formatSlot in lib/format-time.
import { userTimeZone, zoneAbbreviation } from '../../../lib/format-time';

const DAY_MS = 86_400_000;

/** Local midnight of the given day. */
export function startOfDay(date: Date): Date {
  return new Date(date.getFullYear(), date.getMonth(), date.getDate());
}

/** Calendar arithmetic in local time (so a day across a clock change is still one day). */
export function addDays(date: Date, days: number): Date {
  return new Date(date.getFullYear(), date.getMonth(), date.getDate() + days, date.getHours(), date.getMinutes());
}

/** Monday 00:00 of the week the date is in (weeks start on Monday). */
export function startOfWeek(date: Date): Date {
  const day = startOfDay(date);
  const sinceMonday = (day.getDay() + 6) % 7;
  return addDays(day, -sinceMonday);
}

const pad = (value: number) => String(value).padStart(2, '0');

/** YYYY-MM-DD of a local date, for the address (?week=2026-11-30). */
export function dateParam(date: Date): string {
  return `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())}`;
}

/** Reads ?week=YYYY-MM-DD as a local date, or null when it is missing or not a date. */
export function parseDateParam(value: string | null): Date | null {
  const match = value ? /^(\d{4})-(\d{2})-(\d{2})$/.exec(value) : null;
  if (!match) return null;
  const date = new Date(Number(match[1]), Number(match[2]) - 1, Number(match[3]));
  return Number.isNaN(date.getTime()) || dateParam(date) !== value ? null : date;
}

/** The value a datetime-local input shows for an instant, in local time: 2026-12-02T09:00. */
export function localInputValue(date: Date): string {
  return `${dateParam(date)}T${pad(date.getHours())}:${pad(date.getMinutes())}`;
}

/** An instant from a datetime-local value (read as local time), as ISO 8601 with Z; null when empty or invalid. */
export function instantFromLocalInput(value: string): string | null {
  if (!/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2})?$/.test(value)) return null;
  const date = new Date(value);
  return Number.isNaN(date.getTime()) ? null : date.toISOString();
}

/** "3 h", "1 h 30 min", "45 min" */
export function formatDuration(startsAt: string, endsAt: string): string {
  const minutes = Math.round((Date.parse(endsAt) - Date.parse(startsAt)) / 60_000);
  const hours = Math.floor(minutes / 60);
  const rest = minutes % 60;
  if (hours === 0) return `${rest}\u2009min`;
  return rest === 0 ? `${hours}\u2009h` : `${hours}\u2009h ${rest}\u2009min`;
}

/** The share of a local day [dayStart, dayStart + 1 day) that an interval covers, as left/width fractions. */
export function dayShare(dayStart: Date, startsAt: string, endsAt: string): { left: number; width: number } | null {
  const from = dayStart.getTime();
  const to = addDays(dayStart, 1).getTime();
  const start = Math.max(from, Date.parse(startsAt));
  const end = Math.min(to, Date.parse(endsAt));
  if (end <= start) return null;
  const length = to - from || DAY_MS;
  return { left: (start - from) / length, width: (end - start) / length };
}

/** Whether [startsAt, endsAt) overlaps the local day that starts at dayStart. */
export function overlapsDay(dayStart: Date, startsAt: string, endsAt: string): boolean {
  return dayShare(dayStart, startsAt, endsAt) !== null;
}

/** Which week the address asks for (?week=YYYY-MM-DD, any day of it), else the week of `now`. */
export function weekFromParams(params: URLSearchParams, now: number) {
  const weekStart = startOfWeek(parseDateParam(params.get('week')) ?? new Date(now));
  return { weekStart, from: weekStart.toISOString(), to: addDays(weekStart, 7).toISOString() };
}

/** The device's zone for the booking screens, e.g. "Europe/Berlin (CET)", as of the given moment. */
export function zoneLabel(at: number): string {
  const zone = userTimeZone();
  const abbreviation = zoneAbbreviation(new Date(at).toISOString());
  return abbreviation && abbreviation !== zone ? `${zone} (${abbreviation})` : zone;
}
