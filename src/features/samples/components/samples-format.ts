export function overdueText(days: number): string {
  return `Overdue by ${days} day${days === 1 ? '' : 's'}`;
}
