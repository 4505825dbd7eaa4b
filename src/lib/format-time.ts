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
