import sharp from 'sharp';
import { expect, test, type APIRequestContext, type Page } from '@playwright/test';
import { apiAs, ok, plannedRoundup, testedAndAccepted } from './support/ready-roundup';
import { signInAs, signOut } from './support/sign-in';
import { uniqueSuffix } from './support/unique';

// The editorial journey of a roundup, end to end: the writer drafts a product section with a photo and a results
// block and asks for review; the editor comments, the writer resolves it; the editor decides the verdicts, approves
// every chart, signs off every section and sees the roundup become ready to schedule. The roundup is built through
// the API (two boards under one stock load, one of which throttled, each cell accepted with a manual run of record).

/** A roundup in Writing: two boards under one stock load, each cell accepted with a manual run of record. */
async function roundupReadyForEditing(editor: APIRequestContext, tester: APIRequestContext) {
  const suffix = uniqueSuffix();
  const boards = [
    { model: `Tallow B70 ${suffix}`, peakC: 74.2, throttled: false, price: 17900 },
    { model: `Quarry B70 ${suffix}`, peakC: 69.5, throttled: true, price: 16400 },
  ];
  const roundup = await plannedRoundup(editor, {
    title: `Charts check ${suffix}`,
    benchName: `Charts bench ${suffix}`,
    configurations: [{ name: `Stock all-core ${suffix}`, packagePowerW: 230 }],
    boards,
  });
  await testedAndAccepted(editor, tester, roundup, (row) => boards[row]);
  return { roundupId: roundup.roundupId, boards };
}

/** A plain picture standing in for a product photo (the journey needs no real photograph). */
function boardPicture() {
  return sharp({ create: { width: 1200, height: 800, channels: 3, background: { r: 52, g: 84, b: 70 } } })
    .jpeg()
    .toBuffer();
}

/** CSP refusals the browser reports on the console (the policy allows no inline style or script). */
function watchPolicy(page: Page): string[] {
  const refusals: string[] = [];
  page.on('console', (message) => {
    if (/Content Security Policy/i.test(message.text())) refusals.push(`${page.url()}: ${message.text()}`);
  });
  return refusals;
}

async function openWriteUp(page: Page, roundupTitle: string) {
  await page.goto('/roundups');
  await page.getByRole('link', { name: roundupTitle }).first().click();
  await page.getByRole('link', { name: 'Write-up', exact: true }).click();
  // The roundup's own page has the same heading: wait until the write-up is the page shown.
  await expect(page).toHaveURL(/\/roundups\/\d+\/write-up$/);
  await expect(page.getByRole('heading', { level: 1, name: roundupTitle })).toBeVisible();
}

async function openSection(page: Page, roundupTitle: string, title: string) {
  await openWriteUp(page, roundupTitle);
  await page.getByRole('link', { name: title, exact: true }).click();
  await expect(page.getByRole('heading', { level: 1, name: title })).toBeVisible();
}

test('a writer drafts a product section with a photo and a results block and asks for review; the editor comments, the writer resolves it; the editor sets verdicts, approves every chart, signs off every section and sees the roundup become ready to schedule', async ({
  page,
  playwright,
  baseURL,
}) => {
  test.setTimeout(480_000);
  const refusals = watchPolicy(page);
  const editorApi = await apiAs(playwright, baseURL!, 'editor');
  const testerApi = await apiAs(playwright, baseURL!, 'tester');
  const { roundupId, boards } = await roundupReadyForEditing(editorApi, testerApi);
  const roundupTitle = (await ok<{ title: string }>(editorApi.get(`/api/roundups/${roundupId}`))).title;
  const boardName = `Korvath ${boards[0].model}`;

  // The tester's overview photo of the first board, with its alt text.
  const matrix = await ok<{ rows: { entryId: number }[] }>(testerApi.get(`/api/roundups/${roundupId}/matrix`));
  await ok(
    testerApi.post(`/api/roundups/${roundupId}/entries/${matrix.rows[0].entryId}/photos`, {
      multipart: {
        file: { name: 'top.jpg', mimeType: 'image/jpeg', buffer: await boardPicture() },
        kind: 'overview',
        caption: `${boardName} on the open bench`,
        altText: `Top view of the ${boardName} with its V-core heatsinks left of the socket`,
      },
    }),
  );

  // The writer drafts, renames the section, and asks for review.
  await signInAs(page, 'writer');
  await openSection(page, roundupTitle, boardName);
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
  await expect(editor.locator(`img[alt*="Top view of the ${boardName}"]`)).toBeVisible();
  await inserts.getByLabel('Live block').selectOption('results');
  await inserts.getByLabel('of product').selectOption({ label: boardName });
  await inserts.getByRole('button', { name: 'Insert live block' }).click();
  const results = editor.getByLabel(`Live block: Results table of ${boardName}`);
  await expect(results).toBeVisible();
  await expect(results.getByRole('table')).toContainText('Package power');

  // Section titles are the writer's: an empty one is refused in words, the text goes on saving.
  const sectionTitle = `${boardName}: cool at stock`;
  const titleField = page.getByLabel('Section title');
  await titleField.fill('');
  await expect(page.getByText('Give the section a title; the text keeps saving meanwhile.')).toBeVisible();
  await titleField.fill(sectionTitle);
  await expect(page.locator('[data-save-status]')).toHaveText('All changes saved', { timeout: 15_000 });
  await expect(page.getByRole('heading', { level: 1, name: sectionTitle })).toBeVisible();
  // The editor ran under the strict policy: no inline style tag refused.
  expect(refusals).toEqual([]);
  await page.getByRole('button', { name: 'Ask for review' }).click();
  await expect(page.getByText('With the editor', { exact: true })).toBeVisible();
  await signOut(page);

  // The editor reads it and comments.
  await signInAs(page, 'editor');
  await openSection(page, roundupTitle, sectionTitle);
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
  await openSection(page, roundupTitle, sectionTitle);
  const thread = page.getByRole('list', { name: 'Open threads' }).getByRole('listitem').first();
  await thread.getByRole('button', { name: 'Reply' }).click();
  await thread.getByLabel('Your reply').fill('The one above the rear I/O; added to the text.');
  await thread.getByRole('button', { name: 'Send reply' }).click();
  await expect(thread).toContainText('The one above the rear I/O');
  await thread.getByRole('button', { name: 'Resolve' }).click();
  await expect(page.getByText('No open comments.')).toBeVisible();
  await signOut(page);

  // The editor decides the verdicts. The cool board: a bench pick, which the measurements back.
  await signInAs(page, 'editor');
  await page.goto(`/roundups/${roundupId}`);
  await page.getByRole('navigation', { name: 'Editorial' }).getByRole('link', { name: 'Verdicts' }).click();
  await expect(page.getByRole('heading', { name: 'Verdicts', level: 1 })).toBeVisible();
  const cool = page.getByRole('region', { name: boardName });
  await cool.getByLabel('Label').selectOption({ label: 'Bench pick' });
  await cool.getByLabel('Best for').fill('A quiet stock build that stays cool');
  await expect(cool.getByLabel('Price at publication')).toHaveValue('179.00');
  await cool.getByRole('button', { name: 'Save verdict' }).click();
  await expect(cool.getByRole('status').filter({ hasText: 'Saved' })).toBeVisible();

  // The board that throttled: recommending it needs a written reason, and nothing typed is lost on the way.
  const hot = page.getByRole('region', { name: `Korvath ${boards[1].model}` });
  await expect(hot.getByText('Throttled', { exact: true })).toBeVisible();
  await hot.getByLabel('Label').selectOption({ label: 'Recommended' });
  await expect(hot.getByText('This label goes against the measurements')).toBeVisible();
  await hot.getByLabel('Best for').fill('Budget builds that never raise the clocks');
  await hot.getByRole('button', { name: 'Save verdict' }).click();
  await expect(hot.getByText('write why it stands')).toBeVisible();
  await expect(hot.getByLabel('Best for')).toHaveValue('Budget builds that never raise the clocks');
  await hot
    .getByLabel('Reason')
    .fill('It throttled once at a load no stock board of this price holds; at stock it is the value pick.');
  await hot.getByRole('button', { name: 'Save verdict' }).click();
  await expect(hot.getByRole('status').filter({ hasText: 'Saved' })).toBeVisible();

  // Charts: the throttled board is labelled in words as well as hatched; approve each chart.
  await page.getByRole('navigation', { name: 'Editorial' }).getByRole('link', { name: 'Charts' }).click();
  await expect(page.getByRole('heading', { name: 'Charts', level: 1 })).toBeVisible();
  await expect(page.getByRole('img', { name: /Throttled/ }).first()).toBeVisible();
  const approveButtons = page.getByRole('button', { name: /^(Approve chart|Approve again)$/ });
  await expect(approveButtons).toHaveCount(4);
  for (let left = 4; left > 0; left--) {
    await approveButtons.first().click();
    await expect(approveButtons).toHaveCount(left - 1);
  }
  await expect(page.getByText('Every chart with something to draw is approved.')).toBeVisible();

  // Send to review. What still blocks is the write-up, each section named by its title (the writer's new one too).
  await page
    .getByRole('navigation', { name: 'Editorial' })
    .getByRole('link', { name: /Ready to schedule/ })
    .click();
  await expect(page.getByRole('heading', { name: 'Ready to schedule?', level: 1 })).toBeVisible();
  await expect(page.getByRole('link', { name: /Write-up section/ }).first()).toBeVisible();
  await expect(
    page.getByRole('link', { name: `Write-up section “${sectionTitle}” is With the editor, not signed off.` }),
  ).toBeVisible();
  await expect(page.getByRole('link', { name: /has no verdict label/ })).toHaveCount(0);
  await page.getByRole('button', { name: 'Send to review' }).click();
  await expect(page.getByText('The roundup is In review.')).toBeVisible();

  // The editor signs off every section. Signing off over an open thread asks first, and "go back" changes nothing.
  await openWriteUp(page, roundupTitle);
  const sectionLinks = page.getByRole('region', { name: 'Sections' }).getByRole('link');
  const titles = await sectionLinks.allTextContents();
  expect(titles.length).toBeGreaterThanOrEqual(4);
  expect(titles).toContain(sectionTitle);
  for (const [index, title] of titles.entries()) {
    await openSection(page, roundupTitle, title);
    if (index === 0) {
      await page.getByLabel('New comment').fill('One more look at the opening line, please.');
      await page.getByRole('button', { name: 'Add comment' }).click();
      await expect(page.getByRole('list', { name: 'Open threads' })).toContainText('One more look');
      await page.getByRole('button', { name: 'Sign off' }).click();
      const warning = page.getByRole('dialog', { name: 'Sign off with 1 open comment thread?' });
      await expect(warning).toContainText('the roundup cannot be ready to schedule while a thread is open');
      await warning.getByRole('button', { name: 'Go back to the comments' }).click();
      await expect(warning).toBeHidden();
      await expect(page.getByText('Signed off', { exact: true })).toHaveCount(0);
      await page.getByRole('list', { name: 'Open threads' }).getByRole('button', { name: 'Resolve' }).click();
      await expect(page.getByText('No open comments.')).toBeVisible();
    }
    await page.getByRole('button', { name: 'Sign off' }).click();
    await expect(page.getByText('Signed off', { exact: true })).toBeVisible();
  }
  await openWriteUp(page, roundupTitle);
  await expect(page.getByText('Every section is signed off and no comment thread is open.')).toBeVisible();

  // The preview renders the write-up from current data, under the writer's section title.
  const preview = await page.request.get(
    (await page.getByRole('link', { name: /Preview the public page/ }).getAttribute('href')) ?? '',
  );
  expect(preview.status()).toBe(200);
  const html = await preview.text();
  expect(html).toContain('The rear heatsink is thin but the stages run cool at stock.');
  expect(html).toContain(`>${sectionTitle}</h2>`);
  expect(html).toContain('Caution: hot surfaces');

  // Nothing blocks any more: the roundup is ready to schedule.
  await page.goto(`/roundups/${roundupId}/readiness`);
  await expect(page.getByText('Ready to schedule', { exact: true })).toBeVisible();
  // The roundup itself shows the computed condition.
  await page.goto(`/roundups/${roundupId}`);
  await expect(
    page.getByRole('navigation', { name: 'Editorial' }).getByRole('link', { name: 'Ready to schedule ✓' }),
  ).toBeVisible();
  expect(refusals).toEqual([]);

  await editorApi.dispose();
  await testerApi.dispose();
});
