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
