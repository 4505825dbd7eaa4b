import { expect, test, type Page } from '@playwright/test';
import { signInAs, signOut } from './support/sign-in';

// The seeded demo roundup in Writing (server/seed/demo-planning.ts) and its second board, whose section the seed
// leaves as the first draft (server/seed/demo-write-up.ts).
const roundupTitle = 'Helix-1700 flagship boards';
const boardName = 'Ostrel Works Fenwright X90';

async function openWriteUp(page: Page) {
  await page.goto('/roundups');
  await page.getByRole('link', { name: roundupTitle }).first().click();
  await page.getByRole('link', { name: 'Write-up', exact: true }).click();
  await expect(page.getByRole('heading', { level: 1, name: roundupTitle })).toBeVisible();
}

async function openSection(page: Page, title: string) {
  await openWriteUp(page);
  await page.getByRole('link', { name: title, exact: true }).click();
  await expect(page.getByRole('heading', { level: 1, name: title })).toBeVisible();
}

test('a writer drafts a product section with a photo and a results block and asks for review; the editor comments, the writer resolves it, the editor signs off every section', async ({
  page,
}) => {
  test.setTimeout(360_000);

  // The writer drafts.
  await signInAs(page, 'writer');
  await openSection(page, boardName);
  const editor = page.getByRole('textbox', { name: `Product section: ${boardName}` });
  await expect(editor).toBeVisible();
  await editor.click();
  await page.keyboard.press('ControlOrMeta+End');
  await page.keyboard.press('Enter');
  await page.keyboard.type('The rear heatsink is thin but the stages run cool at stock.');
  await expect(page.locator('[data-save-status]')).toHaveText(/Unsaved changes|Saving…|All changes saved/);

  const inserts = page.getByRole('group', { name: 'Insert blocks' });
  await expect(inserts.getByLabel('Photo (alt text comes with it)')).toContainText(boardName);
  await inserts.getByRole('button', { name: 'Insert photo' }).click();
  await expect(editor.locator('img[alt*="Top view of the Ostrel Works Fenwright X90"]')).toBeVisible();
  await inserts.getByLabel('Live block').selectOption('results');
  await inserts.getByRole('button', { name: 'Insert live block' }).click();
  const results = editor.getByLabel(`Live block: Results table of ${boardName}`);
  await expect(results).toBeVisible();
  await expect(results.getByRole('table')).toContainText('Package power');

  await expect(page.locator('[data-save-status]')).toHaveText('All changes saved', { timeout: 15_000 });
  await page.getByRole('button', { name: 'Ask for review' }).click();
  await expect(page.getByText('With the editor', { exact: true })).toBeVisible();
  await signOut(page);

  // The editor reads it and comments.
  await signInAs(page, 'editor');
  await openSection(page, boardName);
  await expect(
    page.getByRole('textbox', { name: `Product section: ${boardName}` }).locator('img[alt*="Top view"]'),
  ).toBeVisible();
  await page.getByLabel('New comment').fill('Say which heatsink the probe sat under.');
  await page.getByRole('button', { name: 'Add comment' }).click();
  const openThreads = page.getByRole('list', { name: 'Open threads' });
  await expect(openThreads).toContainText('Say which heatsink the probe sat under.');
  await signOut(page);

  // The writer answers and resolves the thread.
  await signInAs(page, 'writer');
  await openSection(page, boardName);
  const thread = page.getByRole('list', { name: 'Open threads' }).getByRole('listitem').first();
  await thread.getByRole('button', { name: 'Reply' }).click();
  await thread.getByLabel('Your reply').fill('The one above the rear I/O; added to the text.');
  await thread.getByRole('button', { name: 'Send reply' }).click();
  await expect(thread).toContainText('The one above the rear I/O');
  await thread.getByRole('button', { name: 'Resolve' }).click();
  await expect(page.getByText('No open comments.')).toBeVisible();
  await signOut(page);

  // The editor signs off every section.
  await signInAs(page, 'editor');
  await openWriteUp(page);
  const sectionLinks = page.getByRole('region', { name: 'Sections' }).getByRole('link');
  const titles = await sectionLinks.allTextContents();
  expect(titles.length).toBeGreaterThanOrEqual(4);
  for (const title of titles) {
    await openSection(page, title);
    await page.getByRole('button', { name: 'Sign off' }).click();
    await expect(page.getByText('Signed off', { exact: true })).toBeVisible();
  }
  await openWriteUp(page);
  await expect(page.getByText('Every section is signed off and no comment thread is open.')).toBeVisible();
  // The roundup's readiness (charts signed off too, then "ready to schedule") continues from here on the roundup's
  // review screen; the write-up's part of it is GET /api/roundups/:id/write-up `blocking`, now empty.

  // The preview renders the write-up from current data.
  const preview = await page.request.get(
    (await page.getByRole('link', { name: /Preview the public page/ }).getAttribute('href')) ?? '',
  );
  expect(preview.status()).toBe(200);
  const html = await preview.text();
  expect(html).toContain('The rear heatsink is thin but the stages run cool at stock.');
  expect(html).toContain('Caution: hot surfaces');
});
