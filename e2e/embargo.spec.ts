import { expect, test } from '@playwright/test';
import { createConnection } from 'mysql2/promise';
import { signInAs } from './support/sign-in';
import { uniqueSuffix } from './support/unique';

// The acceptance test of embargo publishing (issue 10): an editor schedules a roundup a few seconds ahead in a
// named time zone; before that time its public page answers 404; the job runner in the server makes it live; a
// reader without an account opens it. The writing and review steps belong to the editorial work, so the roundup is
// put In review directly in the database, where those steps would leave it.

/** The local date and HH:MM:SS of an instant in a zone, as the schedule form takes them. */
function localIn(instant: Date, timeZone: string) {
  const parts = new Intl.DateTimeFormat('en-CA', {
    timeZone,
    hourCycle: 'h23',
    year: 'numeric',
    month: '2-digit',
    day: '2-digit',
    hour: '2-digit',
    minute: '2-digit',
    second: '2-digit',
  }).formatToParts(instant);
  const part = (type: string) => parts.find((p) => p.type === type)?.value ?? '';
  return {
    date: `${part('year')}-${part('month')}-${part('day')}`,
    time: `${part('hour')}:${part('minute')}:${part('second')}`,
  };
}

test('an editor schedules a roundup a few seconds ahead; it goes live; a reader opens it', async ({
  page,
  browser,
}) => {
  test.setTimeout(120_000);
  await signInAs(page, 'editor');

  // A roundup of the demo outlet's own profile and configurations, then In review.
  const profiles = (await (await page.request.get('/api/bench-profiles')).json()) as
    { profiles?: { id: number }[] } | { id: number }[];
  const profileList = Array.isArray(profiles) ? profiles : (profiles.profiles ?? []);
  const configurations = (await (await page.request.get('/api/load-configurations')).json()) as
    { configurations?: { id: number }[] } | { id: number }[];
  const configurationList = Array.isArray(configurations) ? configurations : (configurations.configurations ?? []);
  const title = `Helix-1700 embargo check ${uniqueSuffix()}`;
  const created = await page.request.post('/api/roundups', {
    data: {
      title,
      category: 'motherboard',
      platform: 'Helix-1700',
      priceBand: { minMinor: 15000, maxMinor: 22000, currency: 'EUR', region: 'DE' },
      targetPublishDate: null,
      timeZone: 'Europe/Berlin',
      benchProfileId: profileList[0]?.id ?? null,
      loadConfigurationIds: configurationList.slice(0, 1).map((c) => c.id),
    },
    headers: { Origin: new URL(page.url()).origin },
  });
  expect(created.status(), await created.text()).toBe(201);
  const roundupId = ((await created.json()) as { id: number }).id;
  const db = await createConnection(process.env.DATABASE_URL as string);
  await db.query("UPDATE roundups SET state = 'in-review' WHERE id = ?", [roundupId]);
  await db.end();

  await page.goto(`/roundups/${roundupId}?tab=publishing`);
  const at = new Date(Math.ceil((Date.now() + 12_000) / 1000) * 1000);
  const local = localIn(at, 'America/Los_Angeles');
  await page.getByLabel('Date').fill(local.date);
  await page.getByLabel('Time', { exact: true }).fill(local.time);
  await page.getByLabel('Time zone').fill('America/Los_Angeles');
  await expect(page.getByText(`= ${at.toISOString()} UTC`)).toBeVisible();
  await page.getByRole('button', { name: 'Schedule', exact: true }).click();
  await expect(page.getByTestId('schedule-summary')).toContainText(at.toISOString());

  // Before the time: a reader finds nothing.
  const reader = await browser.newContext();
  const readerPage = await reader.newPage();
  const publishing = (await (await page.request.get(`/api/roundups/${roundupId}/publishing`)).json()) as {
    state: string;
  };
  expect(publishing.state).toBe('scheduled');
  const home = await readerPage.goto('/read');
  expect(await readerPage.content()).not.toContain(title);
  void home;

  // The server's job runner publishes it within seconds of the time; the staff page follows.
  await expect(page.getByText('The roundup is live')).toBeVisible({ timeout: 45_000 });
  const publicPath = await page
    .getByRole('link', { name: /^\/read\/roundups\// })
    .first()
    .textContent();
  expect(Date.now()).toBeGreaterThanOrEqual(at.getTime());

  const response = await readerPage.goto(publicPath as string);
  expect(response?.status()).toBe(200);
  await expect(readerPage.getByRole('heading', { level: 1 })).toContainText(title);
  await reader.close();
});
