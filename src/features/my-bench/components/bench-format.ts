const calendarDate = new Intl.DateTimeFormat('en-GB', {
  day: '2-digit',
  month: 'short',
  year: 'numeric',
  timeZone: 'UTC',
});

/** "14 Mar 2025" for a calendar date (YYYY-MM-DD). */
export function formatCalendarDate(date: string): string {
  const [year, month, day] = date.split('-').map(Number);
  return calendarDate.format(new Date(Date.UTC(year, month - 1, day)));
}

export function productName(product: { maker: string; model: string }): string {
  return `${product.maker} ${product.model}`;
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

/** "Tue 03 Dec, 09:00 – 13:00" (or with both days when the slot crosses midnight), in the device's zone. */
export function formatSlot(startsAt: string, endsAt: string): string {
  const start = new Date(startsAt);
  const end = new Date(endsAt);
  const sameDay = start.toDateString() === end.toDateString();
  return `${dayAndTime.format(start)} – ${sameDay ? timeOnly.format(end) : dayAndTime.format(end)}`;
}

/** A `datetime-local` value (wall time in the device's zone) as a UTC instant, or null when incomplete. */
export function localInputToInstant(value: string): string | null {
  if (!/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}/.test(value)) return null;
  const date = new Date(value);
  return Number.isNaN(date.getTime()) ? null : date.toISOString();
}
