import { expect, test, type APIRequestContext, type Page } from '@playwright/test';
import { apiAs, readyRoundup } from './support/ready-roundup';
import { scheduleAhead } from './support/local-time';
import { signInAs } from './support/sign-in';
import { uniqueSuffix } from './support/unique';
import { seriousViolations } from './support/axe';

// The acceptance test of subscribers and mail (issue 11): a reader subscribes on the public site and confirms from
// the mail the local relay kept (the admin's dev inbox); a roundup goes live at its embargo time; the go-live mail
// arrives; the reader follows its link, then unsubscribes in one click, and the next mailing skips them. The
// roundup is made ready to schedule through the API, as the editorial steps leave it (as in embargo.spec.ts).

interface InboxItem {
  id: number;
  to: string;
  subject: string;
}

/** The local relay's messages to an address, newest first (the admin's dev inbox API). */
async function inboxOf(request: APIRequestContext, to: string): Promise<InboxItem[]> {
  const response = await request.get(`/api/dev-inbox?to=${encodeURIComponent(to)}&limit=200`);
  expect(response.status()).toBe(200);
  return ((await response.json()) as { messages: InboxItem[] }).messages;
}

/** Waits until the dev inbox holds a message to `to` whose subject matches, and returns it. */
async function waitForMail(request: APIRequestContext, to: string, subject: RegExp): Promise<InboxItem> {
  let found: InboxItem | undefined;
  await expect
    .poll(
      async () => {
        found = (await inboxOf(request, to)).find((m) => subject.test(m.subject));
        return Boolean(found);
      },
      { timeout: 60_000, intervals: [500, 1000, 2000] },
    )
    .toBe(true);
  return found!;
}

/** Opens a message in the dev inbox page and returns its plain text as the page shows it. */
async function readInDevInbox(page: Page, item: InboxItem): Promise<string> {
  await page.goto('/dev-inbox');
  await page
    .getByRole('navigation', { name: 'Messages' })
    .getByRole('button', { name: new RegExp(`To ${item.to.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}`) })
    .filter({ hasText: item.subject })
    .first()
    .click();
  await expect(page.getByRole('heading', { name: item.subject })).toBeVisible();
  await page.getByRole('button', { name: 'Plain text' }).click();
  return (await page.locator('pre').first().textContent()) ?? '';
}

function linkIn(text: string, pattern: RegExp): string {
  const found = text.split(/\s+/).find((word) => pattern.test(word));
  if (!found) throw new Error(`no link matching ${pattern} in:\n${text}`);
  return found;
}

test('a reader subscribes, confirms from the dev inbox, gets the go-live mail, unsubscribes in one click and is skipped next time', async ({
  browser,
  playwright,
  baseURL,
}) => {
  test.setTimeout(240_000);
  const suffix = uniqueSuffix();
  const readerAddress = `reader-${suffix}@readers.soaksheet.example`;
  const stayingAddress = `staying-${suffix}@readers.soaksheet.example`;

  const adminContext = await browser.newContext();
  const admin = await adminContext.newPage();
  await signInAs(admin, 'admin');

  // 1. The reader signs up on the public site (no account, no JavaScript needed).
  const readerContext = await browser.newContext();
  const reader = await readerContext.newPage();
  await reader.goto('/subscribe');
  await reader.getByLabel('E-mail address').fill(readerAddress);
  await reader.getByRole('checkbox', { name: /Every new roundup/ }).check();
  await reader.getByRole('button', { name: 'Subscribe' }).click();
  await expect(reader.getByRole('heading', { name: 'Check your inbox' })).toBeVisible();

  // 2. The confirmation arrives in the dev inbox; the reader opens its link and confirms.
  const confirmation = await waitForMail(admin.request, readerAddress, /^Confirm your subscription/);
  const confirmText = await readInDevInbox(admin, confirmation);
  await reader.goto(linkIn(confirmText, /\/subscribe\/confirm\//));
  await expect(reader.getByRole('heading', { name: 'Confirm your subscription' })).toBeVisible();
  await reader.getByRole('button', { name: 'Confirm my subscription' }).click();
  await expect(reader.getByRole('heading', { name: 'You are subscribed' })).toBeVisible();

  // A second reader who stays subscribed: the next mailing goes to them and not to the one who left.
  const staying = await reader.request.post('/api/subscribers', {
    data: { email: stayingAddress, categoryIds: await everyRoundupCategory(reader.request) },
    headers: { Origin: new URL(reader.url()).origin },
  });
  expect(staying.status(), await staying.text()).toBe(202);
  const stayingConfirm = await waitForMail(admin.request, stayingAddress, /^Confirm your subscription/);
  const stayingLink = linkIn(await readInDevInbox(admin, stayingConfirm), /\/subscribe\/confirm\//);
  const confirmed = await reader.request.post(new URL(stayingLink).pathname, {
    headers: { Origin: new URL(reader.url()).origin },
  });
  expect(confirmed.status()).toBe(200);

  // 3. An editor schedules a roundup a few seconds ahead; the job runner makes it live at that time.
  const editorContext = await browser.newContext();
  const editor = await editorContext.newPage();
  await signInAs(editor, 'editor');
  // A roundup genuinely ready to schedule, made through the API as staff make it (as in embargo.spec.ts).
  const editorApi = await apiAs(playwright, baseURL!, 'editor');
  const testerApi = await apiAs(playwright, baseURL!, 'tester');
  const { roundupId, title } = await readyRoundup(editorApi, testerApi);
  await editorApi.dispose();
  await testerApi.dispose();

  await editor.goto(`/roundups/${roundupId}?tab=publishing`);
  await scheduleAhead(editor, 12, 'Europe/Berlin');
  await expect(editor.getByText('The roundup is live')).toBeVisible({ timeout: 60_000 });

  // 4. The subscribers page shows the go-live mailing's progress bar until every row is done.
  await editor.goto('/subscribers');
  await expect(editor.getByRole('heading', { name: 'Subscribers', level: 1 })).toBeVisible();
  const section = editor.locator(`section[aria-labelledby="mail-${roundupId}"]`);
  await expect(section.getByRole('heading', { name: title, exact: true })).toBeVisible();
  const goLiveBar = section.getByRole('progressbar', { name: 'Go-live mail' });
  await expect(async () => {
    await editor.reload();
    await expect(goLiveBar).toBeVisible({ timeout: 2_000 });
    const max = Number(await goLiveBar.getAttribute('aria-valuemax'));
    expect(max).toBeGreaterThanOrEqual(2);
    expect(Number(await goLiveBar.getAttribute('aria-valuenow'))).toBe(max);
  }).toPass({ timeout: 90_000, intervals: [1000, 2000, 3000] });
  await expect(section.getByText(/Go-live mail · (\d+) of \1 done/)).toBeVisible();

  // 5. The go-live mail is in the dev inbox, HTML and plain text; the reader follows its link to the results.
  const goLive = await waitForMail(admin.request, readerAddress, new RegExp(`^New roundup: ${title}$`));
  const goLiveText = await readInDevInbox(admin, goLive);
  await admin.getByRole('button', { name: 'HTML' }).click();
  const frame = admin.frameLocator(`iframe[title="HTML of “${goLive.subject}”"]`);
  await expect(frame.getByRole('heading', { name: title })).toBeVisible();
  await expect(frame.getByRole('link', { name: 'Read the results' })).toBeVisible();
  await expect(frame.getByRole('link', { name: 'Unsubscribe' })).toBeVisible();
  const results = await reader.goto(linkIn(goLiveText, /\/read\/roundups\//));
  expect(results?.status()).toBe(200);
  await expect(reader.getByRole('heading', { level: 1 })).toContainText(title);

  // 6. One click on the mail's unsubscribe link: a page with one button (link scanners only GET), then done.
  await reader.goto(linkIn(goLiveText, /\/unsubscribe\//));
  await expect(reader.getByRole('heading', { name: 'Unsubscribe?' })).toBeVisible();
  await reader.getByRole('button', { name: 'Unsubscribe' }).click();
  await expect(reader.getByRole('heading', { name: 'You are unsubscribed' })).toBeVisible();

  // 7. The editor mails an update: the staying reader gets it, the one who left does not.
  await editor.goto('/subscribers');
  await section.getByLabel('What changed (subscribers read this first)').fill('Prices checked again this week.');
  await section.getByRole('button', { name: 'Mail this update to subscribers' }).click();
  const updateBar = section.getByRole('progressbar', { name: 'Update mail' });
  await expect(async () => {
    await editor.reload();
    await expect(updateBar).toBeVisible({ timeout: 2_000 });
    expect(Number(await updateBar.getAttribute('aria-valuenow'))).toBe(
      Number(await updateBar.getAttribute('aria-valuemax')),
    );
  }).toPass({ timeout: 90_000, intervals: [1000, 2000, 3000] });
  await waitForMail(admin.request, stayingAddress, new RegExp(`^Updated: ${title}$`));
  const readerMail = await inboxOf(admin.request, readerAddress);
  expect(readerMail.filter((m) => m.subject.includes(title)).map((m) => m.subject)).toEqual([`New roundup: ${title}`]);

  await readerContext.close();
  await editorContext.close();
  await adminContext.close();
});

async function everyRoundupCategory(request: APIRequestContext): Promise<number[]> {
  const { categories } = (await (await request.get('/api/mail-categories')).json()) as {
    categories: { id: number; name: string }[];
  };
  return categories.filter((c) => c.name === 'Every new roundup').map((c) => c.id);
}

test('the go-live, confirmation and reminder e-mails have no serious or critical accessibility violation', async ({
  browser,
}) => {
  test.setTimeout(120_000);
  const adminContext = await browser.newContext();
  const admin = await adminContext.newPage();
  await signInAs(admin, 'admin');
  const editorContext = await browser.newContext();
  const editor = await editorContext.newPage();
  const editorAccount = await signInAs(editor, 'editor');

  // The go-live mail of the demo's flagship roundup (verdicts and an approved chart), as a test to the editor.
  const sentTest = await editor.request.post('/api/roundups/1/mailings/test', {
    data: {},
    headers: { Origin: new URL(editor.url()).origin },
  });
  expect(sentTest.status(), await sentTest.text()).toBeLessThan(300);
  const goLive = await waitForMail(admin.request, editorAccount.email, /^Test — new roundup: /);

  // A confirmation, from a fresh sign-up.
  const address = `axe-${uniqueSuffix()}@readers.soaksheet.example`;
  const signUp = await editor.request.post('/api/subscribers', {
    data: { email: address, categoryIds: await everyRoundupCategory(editor.request) },
    headers: { Origin: new URL(editor.url()).origin },
  });
  expect(signUp.status()).toBe(202);
  const confirmation = await waitForMail(admin.request, address, /^Confirm your subscription/);

  // A staff reminder: the server's reminder scan mails editors about the demo's overdue loans at start.
  const reminder = await waitForMail(admin.request, editorAccount.email, /^(Overdue|Due back in three days): /);

  const found: string[] = [];
  const page = await adminContext.newPage();
  for (const item of [goLive, confirmation, reminder]) {
    const message = (await (await admin.request.get(`/api/dev-inbox/${item.id}`)).json()) as {
      html: string | null;
      text: string | null;
    };
    expect(message.html, `${item.subject} has an HTML part`).not.toBeNull();
    expect(message.text, `${item.subject} has a plain-text part`).toBeTruthy();
    await page.setContent(message.html!);
    for (const violation of await seriousViolations(page)) found.push(`${item.subject}: ${violation}`);
    if (item === goLive) {
      // The chart travels inline with alt text saying what it shows.
      await expect(page.getByRole('img', { name: /^Chart: / })).toBeVisible();
      await expect(page.getByRole('heading', { name: 'Top picks' })).toBeVisible();
    }
  }
  // The dev inbox with a message open (its views and the message panel), light and dark. The HTML frame itself is
  // a page of its own, swept above.
  for (const colorScheme of ['light', 'dark'] as const) {
    await admin.emulateMedia({ colorScheme });
    await readInDevInbox(admin, reminder);
    for (const violation of await seriousViolations(admin)) found.push(`dev inbox (${colorScheme}): ${violation}`);
  }
  expect(found).toEqual([]);
  await adminContext.close();
  await editorContext.close();
});
