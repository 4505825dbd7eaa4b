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

/** "Tue 03 Dec, 09:00 – 13:00" in the device's zone. */
export function formatSlot(startsAt: string, endsAt: string): string {
  const start = new Date(startsAt);
  const end = new Date(endsAt);
  const sameDay = start.toDateString() === end.toDateString();
  return `${dayAndTime.format(start)} – ${sameDay ? timeOnly.format(end) : dayAndTime.format(end)}`;
}

/** Soonest target publish date first; roundups without one last. */
export function byTargetDate(a: { targetPublishDate: string | null }, b: { targetPublishDate: string | null }) {
  if (a.targetPublishDate === b.targetPublishDate) return 0;
  if (a.targetPublishDate === null) return 1;
  if (b.targetPublishDate === null) return -1;
  return a.targetPublishDate < b.targetPublishDate ? -1 : 1;
}
