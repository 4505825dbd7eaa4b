// Every date and time on staff screens is written here, in the user's own locale as the browser reports it
// (navigator.languages): the locale decides the order of day and month and whether clocks run 24 hours or 12.
// Nothing here forces a locale or an hour cycle; calendar dates and instants only differ in the zone they are read in.

/** The user's locales, most preferred first; undefined outside a browser (the runtime's default then applies). */
export function userLocales(): readonly string[] | undefined {
  return typeof navigator === 'undefined' || navigator.languages.length === 0 ? undefined : navigator.languages;
}

const formatters = new Map<string, Intl.DateTimeFormat>();

/** One Intl.DateTimeFormat per locale list and options, built on first use (the locale can change between pages). */
function formatter(options: Intl.DateTimeFormatOptions): Intl.DateTimeFormat {
  const locales = userLocales();
  const key = JSON.stringify([locales, options]);
  let found = formatters.get(key);
  if (!found) {
    found = new Intl.DateTimeFormat(locales as string[] | undefined, options);
    formatters.set(key, found);
  }
  return found;
}

// The locale's own patterns (CLDR's short time, medium date) rather than fields picked here: "09:00" in en-GB,
// "9:00 AM" in en-US, "01.12.2026" in de-DE.
const timeOfDay: Intl.DateTimeFormatOptions = { timeStyle: 'short' };
const dateAndTime: Intl.DateTimeFormatOptions = { dateStyle: 'medium', timeStyle: 'short' };
const dayHeading: Intl.DateTimeFormatOptions = { weekday: 'short', day: 'numeric', month: 'short' };

/** The zone the browser runs in, e.g. "Europe/Oslo"; times on staff screens are shown in it and it is named. */
export function userTimeZone(): string {
  return Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC';
}

/** A date and time in the user's zone and locale, from an ISO 8601 instant: "3 Mar 2025, 14:05" in en-GB. */
export function formatInstant(iso: string): string {
  return formatter(dateAndTime).format(new Date(iso));
}

/** Short zone label for a given instant, e.g. "CET" or "GMT+1", for use next to a time. */
export function zoneAbbreviation(iso: string): string {
  const parts = formatter({ timeZoneName: 'short' }).formatToParts(new Date(iso));
  return parts.find((part) => part.type === 'timeZoneName')?.value ?? '';
}

/** A calendar date (YYYY-MM-DD) in the user's locale, "14 Mar 2025" in en-GB; no zone shifts it, because it has none. */
export function formatCalendarDate(date: string): string {
  const [year, month, day] = date.split('-').map(Number);
  return formatter({ dateStyle: 'medium', timeZone: 'UTC' }).format(new Date(Date.UTC(year, month - 1, day)));
}

/** A weekday, day and time in the device's zone: "Tue 3 Dec, 09:00" in en-GB. */
export function formatDayAndTime(iso: string): string {
  const date = new Date(iso);
  return `${formatter(dayHeading).format(date)}, ${formatter(timeOfDay).format(date)}`;
}

/**
 * A booked slot in the device's zone: "Tue 3 Dec, 09:00 – 13:00" in en-GB. Under a heading that already names the day,
 * `{ withDay: false }` gives "09:00 – 13:00". A slot that crosses midnight always names both days.
 */
export function formatSlot(startsAt: string, endsAt: string, { withDay = true }: { withDay?: boolean } = {}): string {
  const start = new Date(startsAt);
  const end = new Date(endsAt);
  const timeOnly = formatter(timeOfDay);
  if (start.toDateString() !== end.toDateString()) return `${formatDayAndTime(startsAt)} – ${formatDayAndTime(endsAt)}`;
  return `${withDay ? formatDayAndTime(startsAt) : timeOnly.format(start)} – ${timeOnly.format(end)}`;
}

/** A time of day: "14:05" where the user's clocks run 24 hours, "2:05 PM" where they do not. */
export function formatClockTime(date: Date, options: { seconds?: boolean } = {}): string {
  return formatter(options.seconds ? { timeStyle: 'medium' } : timeOfDay).format(date);
}

/** A day as a column heading: "Tue 2 Dec" in en-GB. */
export function formatDayHeading(date: Date): string {
  return formatter(dayHeading).format(date);
}

/** A day in full, for screen readers: "Tuesday 2 December 2026" in en-GB. */
export function formatLongDay(date: Date): string {
  return formatter({ weekday: 'long', day: 'numeric', month: 'long', year: 'numeric' }).format(date);
}

/** A day and month: "2 Dec" in en-GB. */
export function formatShortDate(date: Date): string {
  return formatter({ day: 'numeric', month: 'short' }).format(date);
}
