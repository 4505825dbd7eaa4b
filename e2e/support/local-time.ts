import { expect, type Page } from '@playwright/test';
import { wallClockAt } from '../../shared/domain/publishing/zoned-time';

/** The local date and HH:MM:SS of an instant in a zone, as the schedule form takes them. */
export function localIn(instant: Date, timeZone: string) {
  const wall = wallClockAt(timeZone, instant);
  const pad = (n: number) => String(n).padStart(2, '0');
  return {
    date: `${wall.year}-${pad(wall.month)}-${pad(wall.day)}`,
    time: `${pad(wall.hour)}:${pad(wall.minute)}:${pad(wall.second)}`,
  };
}

/**
 * On a roundup's Publishing tab: the schedule form filled with the local date and time `secondsAhead` from now (to
 * the whole second) in `timeZone`, its UTC reading checked, and the roundup scheduled. The instant.
 */
export async function scheduleAhead(page: Page, secondsAhead: number, timeZone: string): Promise<Date> {
  const at = new Date(Math.ceil((Date.now() + secondsAhead * 1000) / 1000) * 1000);
  const local = localIn(at, timeZone);
  await page.getByLabel('Date').fill(local.date);
  await page.getByLabel('Time', { exact: true }).fill(local.time);
  await page.getByLabel('Time zone').fill(timeZone);
  await expect(page.getByText(`= ${at.toISOString()} UTC`)).toBeVisible();
  await page.getByRole('button', { name: 'Schedule', exact: true }).click();
  await expect(page.getByTestId('schedule-summary')).toContainText(at.toISOString());
  return at;
}
