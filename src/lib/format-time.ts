/** The zone the browser runs in, e.g. "Europe/Oslo"; times on staff screens are shown in it and it is named. */
export function userTimeZone(): string {
  return Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC';
}

const dateTime = new Intl.DateTimeFormat('en-GB', {
  year: 'numeric',
  month: 'short',
  day: '2-digit',
  hour: '2-digit',
  minute: '2-digit',
  hourCycle: 'h23',
});

/** "03 Mar 2025, 14:05" in the user's zone, from an ISO 8601 instant. */
export function formatInstant(iso: string): string {
  return dateTime.format(new Date(iso));
}

/** Short zone label for a given instant, e.g. "CET" or "GMT+1", for use next to a time. */
export function zoneAbbreviation(iso: string): string {
  const parts = new Intl.DateTimeFormat('en-GB', { timeZoneName: 'short' }).formatToParts(new Date(iso));
  return parts.find((part) => part.type === 'timeZoneName')?.value ?? '';
}

const calendarDate = new Intl.DateTimeFormat('en-GB', {
  day: '2-digit',
  month: 'short',
  year: 'numeric',
  timeZone: 'UTC',
});

/** "14 Mar 2025" for a calendar date (YYYY-MM-DD); no zone shifts it, because it has none. */
export function formatCalendarDate(date: string): string {
  const [year, month, day] = date.split('-').map(Number);
  return calendarDate.format(new Date(Date.UTC(year, month - 1, day)));
}

const dayAndTime = new Intl.DateTimeFormat('en-GB', {
  weekday: 'short',
  day: '2-digit',
  month: 'short',
  hour: '2-digit',
  minute: '2-digit',
  hourCycle: 'h23',
});
const timeOnly = new Intl.DateTimeFormat('en-GB', { hour: '2-digit', minute: '2-digit', hourCycle: 'h23' });

/** "Tue 03 Dec, 09:00" in the device's zone. */
export function formatDayAndTime(iso: string): string {
  return dayAndTime.format(new Date(iso));
}

/**
 * A booked slot in the device's zone: "Tue 03 Dec, 09:00 – 13:00". Under a heading that already names the day,
 * `{ withDay: false }` gives "09:00 – 13:00". A slot that crosses midnight always names both days.
 */
export function formatSlot(startsAt: string, endsAt: string, { withDay = true }: { withDay?: boolean } = {}): string {
  const start = new Date(startsAt);
  const end = new Date(endsAt);
  if (start.toDateString() !== end.toDateString()) return `${dayAndTime.format(start)} – ${dayAndTime.format(end)}`;
  return `${withDay ? dayAndTime.format(start) : timeOnly.format(start)} – ${timeOnly.format(end)}`;
}

/**
 * A time of day as the user's own locale writes it: "14:05" where clocks run 24 hours, "2:05 PM" where they do
 * not. The locale decides the hour cycle; nothing here forces one.
 */
export function formatClockTime(date: Date, options: { seconds?: boolean } = {}): string {
  const locales = typeof navigator === 'undefined' ? undefined : navigator.languages;
  return new Intl.DateTimeFormat(locales, {
    hour: 'numeric',
    minute: '2-digit',
    ...(options.seconds ? { second: '2-digit' } : {}),
  }).format(date);
}
