import { expect, test } from '@playwright/test';
import { onOwnAccountPage } from './support/staff-accounts';

test('a bench tester makes a private calendar address, subscribes to it, and a reset stops the old one', async ({
  page,
  playwright,
  baseURL,
}) => {
  await onOwnAccountPage(page, playwright, baseURL!, 'tester');

  await page.getByRole('button', { name: 'Make my calendar address' }).click();
  const address = page.getByLabel('Your calendar address');
  await expect(address).toHaveValue(/\/api\/calendar\/[A-Za-z0-9_-]{43}\.ics$/);
  const first = await address.inputValue();

  // A calendar app fetches it with no session of its own.
  const calendarApp = await playwright.request.newContext();
  try {
    const feed = await calendarApp.get(first);
    expect(feed.status()).toBe(200);
    expect(feed.headers()['content-type']).toBe('text/calendar; charset=utf-8');
    expect(await feed.text()).toMatch(/^BEGIN:VCALENDAR\r\nVERSION:2\.0\r\n/);

    await page.getByRole('button', { name: 'Reset address' }).click();
    await page.getByRole('dialog').getByRole('button', { name: 'Make a new address' }).click();
    await expect(address).not.toHaveValue(first);
    const second = await address.inputValue();
    expect((await calendarApp.get(first)).status()).toBe(404);
    expect((await calendarApp.get(second)).status()).toBe(200);
  } finally {
    await calendarApp.dispose();
  }
});
