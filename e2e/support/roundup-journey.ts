import { expect } from '@playwright/test';
import type { Driver } from './drivers';
import { localIn } from './local-time';

// The roundup workflow as staff work it in the app, step by step, written once against a Driver so the same steps
// run with the mouse (e2e/whole-product.spec.ts) and with the keyboard alone (e2e/keyboard-journey.spec.ts).
// It works on the seeded demo outlet: its bench profile, its stock load configuration and its catalog.

export const demoProfile = /^Open bench, 21 °C room/;
export const demoLoad = /^HX-16 stock, all-core load/;
export const demoLoadName = 'HX-16 stock, all-core load';

export const dayFromToday = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);

export async function signInWith(d: Driver, email: string, password: string, displayName: string) {
  await d.page.goto('/sign-in');
  await d.fill(d.page.getByLabel('E-mail'), email);
  await d.fill(d.page.getByLabel('Password', { exact: true }), password);
  await d.press(d.page.getByRole('button', { name: 'Sign in' }));
  await expect(d.page.getByRole('button', { name: 'Sign out' })).toBeVisible();
  await expect(d.page.getByRole('banner')).toContainText(displayName);
}

export async function signOutWith(d: Driver) {
  await d.press(d.page.getByRole('button', { name: 'Sign out' }));
  await expect(d.page).toHaveURL(/\/sign-in$/);
}

const mainNav = (d: Driver) => d.page.getByRole('navigation', { name: 'Main' });

/** From anywhere in the app to a roundup's page, through the main navigation and the list. */
export async function openRoundup(d: Driver, title: string) {
  await d.press(mainNav(d).getByRole('link', { name: 'Roundups' }));
  await expect(d.page.getByRole('heading', { level: 1, name: 'Roundups' })).toBeVisible();
  await d.press(d.page.getByRole('link', { name: title }).first());
  await expect(d.page.getByRole('heading', { level: 1, name: title })).toBeVisible();
}

export async function openTab(d: Driver, name: string | RegExp) {
  await d.tab(d.page.getByRole('tablist', { name: 'Roundup sections' }), name);
}

/** The editor plans a roundup on the demo profile and stock load, and adds `count` boards the catalog suggests. */
export async function planRoundup(d: Driver, title: string, count: number): Promise<{ id: number; boards: string[] }> {
  const { page } = d;
  await d.press(mainNav(d).getByRole('link', { name: 'Roundups' }));
  await d.press(page.getByRole('link', { name: 'New roundup' }).first());
  await expect(page.getByRole('heading', { level: 1, name: 'New roundup' })).toBeVisible();
  await d.fill(page.getByLabel('Title'), title);
  await d.fill(page.getByLabel('Platform'), 'Helix-1700');
  await d.fill(page.getByLabel('Lowest price'), '150');
  await d.fill(page.getByLabel('Highest price'), '220');
  await d.fill(page.getByLabel('Currency'), 'EUR');
  await d.fill(page.getByLabel('Region'), 'DE');
  await d.date(page.getByLabel('Target publish date'), dayFromToday(45));
  await d.fill(page.getByLabel('Outlet time zone'), 'Europe/Berlin');
  await d.choose(page.getByRole('combobox', { name: /^Bench profile/ }), demoProfile);
  await d.choose(page.getByRole('combobox', { name: /^Saved configuration/ }), demoLoad);
  await d.press(page.getByRole('button', { name: 'Add to plan' }));
  const plan = page.getByRole('group', { name: 'Load configurations, in test order' }).getByRole('listitem');
  await expect(plan).toHaveCount(1);
  await d.press(page.getByRole('button', { name: 'Create roundup' }));
  await expect(page.getByRole('heading', { level: 1, name: title })).toBeVisible();
  const id = Number(/\/roundups\/(\d+)/.exec(page.url())?.[1]);

  const suggestions = page.getByRole('region', { name: 'Suggested from the catalog' }).getByRole('listitem');
  const boards: string[] = [];
  for (let i = 0; i < count; i++) {
    const first = suggestions.first();
    const name = ((await first.locator('p').first().textContent()) ?? '').trim();
    expect(name).not.toBe('');
    await d.press(first.getByRole('button', { name: `Add ${name}` }));
    await expect(page.getByRole('status').filter({ hasText: `${name} was added` })).toBeVisible();
    await expect(suggestions.filter({ hasText: name })).toHaveCount(0);
    boards.push(name);
  }
  return { id, boards };
}

/** The editor gives every board's row to one tester and puts the roundup on the bench. */
export async function assignAndStart(d: Driver, boards: string[], testerName: string) {
  const { page } = d;
  await openTab(d, /Matrix/);
  const matrix = page.getByRole('table', { name: 'Test matrix: products by load configuration' });
  await expect(matrix.getByRole('row')).toHaveCount(boards.length + 1);
  for (const board of boards) await d.check(page.getByRole('checkbox', { name: `Choose the whole row: ${board}` }));
  await d.choose(page.getByLabel('Tester', { exact: true }), testerName);
  await d.date(page.getByLabel('Due date', { exact: true }), dayFromToday(10));
  await d.press(page.getByRole('button', { name: 'Assign chosen cells' }));
  await expect(page.getByRole('status').filter({ hasText: `assigned to ${testerName}` })).toBeVisible();
  await moveTo(d, 'On the bench');
}

/** The roundup's next state, through the header button and its confirmation. */
export async function moveTo(d: Driver, state: string) {
  const { page } = d;
  await d.press(page.getByRole('button', { name: `Move to ${state}` }).first());
  const dialog = page.getByRole('dialog', { name: `Move to ${state}?` });
  await expect(dialog).toBeVisible();
  await d.press(dialog.getByRole('button', { name: `Move to ${state}` }));
  await expect(dialog).toBeHidden();
  await expect(page.getByText(state, { exact: true }).first()).toBeVisible();
}

/** The tester opens a cell from their queue. */
export async function openQueuedCell(d: Driver, cellLabel: string) {
  await d.press(mainNav(d).getByRole('link', { name: 'My bench' }));
  await expect(d.page.getByRole('heading', { level: 1, name: 'My bench' })).toBeVisible();
  await d.press(d.page.getByRole('link', { name: `Record a run: ${cellLabel}` }));
  await expect(d.page.getByRole('heading', { level: 1, name: cellLabel })).toBeVisible();
}

/** Says why a run is outside the tester's bookings when the server asks, and submits again. */
async function answerBookingQuestion(d: Driver, form: ReturnType<Driver['page']['getByRole']>, submit: string) {
  const reason = form.getByLabel('Why this run is outside your bookings');
  const asked = await Promise.race([
    reason.waitFor({ state: 'visible', timeout: 15_000 }).then(() => true),
    d.page
      .getByText('Run submitted')
      .waitFor({ state: 'visible', timeout: 15_000 })
      .then(() => false),
  ]);
  if (!asked) return;
  await d.fill(reason, 'The soak ran on the open bench while the booked one was busy.');
  await d.press(form.getByRole('button', { name: submit }));
}

/** The tester enters a run by hand (peak and ambient off the meter) and marks the cell recorded. */
export async function recordManualRun(d: Driver, cellLabel: string, peakC: string) {
  const { page } = d;
  await openQueuedCell(d, cellLabel);
  await d.press(page.getByRole('button', { name: 'Enter by hand' }));
  const form = page.getByRole('form', { name: 'Manual entry' });
  await d.fill(form.getByLabel('Firmware (BIOS) version'), '1.04');
  await d.fill(form.getByLabel('Peak VRM temperature (°C)'), peakC);
  await d.fill(form.getByLabel('Ambient (°C)'), '21.0');
  await d.press(form.getByRole('button', { name: 'Save the manual run' }));
  await answerBookingQuestion(d, form, 'Save the manual run');
  await expect(page.getByText('Run submitted')).toBeVisible();
  await markRecorded(d);
}

export async function markRecorded(d: Driver) {
  await d.press(d.page.getByRole('button', { name: 'Mark recorded' }));
  await expect(d.page.getByText(/The cell is Recorded/)).toBeVisible();
}

export { answerBookingQuestion };

/** The editor accepts a cell's run (with a reason when it is flagged) and makes it the run of record. */
export async function acceptRun(d: Driver, title: string, cellLabel: string) {
  const { page } = d;
  await openRoundup(d, title);
  await openTab(d, /Matrix/);
  await d.press(page.getByRole('link', { name: `Runs of ${cellLabel}` }));
  await expect(page.getByRole('heading', { level: 1, name: cellLabel })).toBeVisible();
  await d.press(page.getByRole('button', { name: 'Accept the run' }));
  const accepted = page.getByText('Accepted', { exact: true }).first();
  const reasonAsked = page.getByRole('form', { name: 'Review' }).locator('[aria-invalid="true"]');
  await expect(accepted.or(reasonAsked)).toBeVisible();
  if (await reasonAsked.isVisible()) {
    await d.fill(reasonAsked, 'The board had settled within 0.2 °C for the last ten minutes of the soak.');
    await d.press(page.getByRole('button', { name: 'Accept the run' }));
  }
  await expect(page.getByText('Accepted', { exact: true }).first()).toBeVisible();
  await d.press(page.getByRole('button', { name: 'Mark as run of record' }));
  await expect(page.getByText('★ Run of record')).toBeVisible();
  // The cell itself is accepted on the matrix.
  await d.press(page.getByRole('link', { name: '← Matrix' }));
  const accept = page.getByRole('button', { name: `Accept: ${cellLabel}` });
  await d.press(accept);
  const dialog = page.getByRole('dialog');
  if (await dialog.isVisible().catch(() => false)) await d.press(dialog.getByRole('button', { name: /^Accept/ }));
  await expect(accept).toHaveCount(0);
}

const editorialNav = (d: Driver) => d.page.getByRole('navigation', { name: 'Editorial' });

/** The writer adds a paragraph to a board's section and asks the editor to review it. */
export async function writeSection(d: Driver, title: string, board: string, text: string) {
  const { page } = d;
  await openRoundup(d, title);
  await d.press(page.getByRole('link', { name: 'Write-up', exact: true }));
  await expect(page.getByRole('heading', { level: 1, name: title })).toBeVisible();
  await d.press(page.getByRole('region', { name: 'Sections' }).getByRole('link', { name: board, exact: true }));
  await expect(page.getByRole('heading', { level: 1, name: board })).toBeVisible();
  const editor = page.getByRole('textbox', { name: `Product section: ${board}` });
  if (d.keyboardOnly) {
    const { tabTo } = await import('./keyboard');
    await tabTo(page, editor);
  } else {
    await editor.click();
  }
  await page.keyboard.press('ControlOrMeta+End');
  await page.keyboard.press('Enter');
  await page.keyboard.type(text);
  await expect(page.locator('[data-save-status]')).toHaveText('All changes saved', { timeout: 15_000 });
  await d.press(page.getByRole('button', { name: 'Ask for review' }));
  await expect(page.getByText('With the editor', { exact: true })).toBeVisible();
}

/** The editor labels every board (a pick the measurements back), approves every chart and signs off the write-up. */
export async function editorFinishes(d: Driver, title: string, boards: string[]) {
  const { page } = d;
  await openRoundup(d, title);
  await d.press(editorialNav(d).getByRole('link', { name: 'Verdicts' }));
  await expect(page.getByRole('heading', { name: 'Verdicts', level: 1 })).toBeVisible();
  for (const board of boards) {
    const card = page.getByRole('region', { name: board });
    await d.choose(card.getByLabel('Label'), 'Recommended');
    await d.fill(card.getByLabel('Best for'), 'A stock build that stays cool');
    await d.press(card.getByRole('button', { name: 'Save verdict' }));
    const saved = card.getByRole('status').filter({ hasText: 'Saved' });
    const reason = card.getByLabel('Reason');
    await expect(saved.or(card.getByText('write why it stands'))).toBeVisible();
    if (!(await saved.isVisible())) {
      await d.fill(reason, 'At stock it holds well below the point where it would slow down.');
      await d.press(card.getByRole('button', { name: 'Save verdict' }));
      await expect(saved).toBeVisible();
    }
  }

  await d.press(editorialNav(d).getByRole('link', { name: 'Charts' }));
  await expect(page.getByRole('heading', { name: 'Charts', level: 1 })).toBeVisible();
  const approve = page.getByRole('button', { name: /^(Approve chart|Approve again)$/ });
  await expect(approve.first()).toBeVisible();
  for (let left = await approve.count(); left > 0; left--) {
    await d.press(approve.first());
    await expect(approve).toHaveCount(left - 1);
  }
  await expect(page.getByText('Every chart with something to draw is approved.')).toBeVisible();

  // Every section of the write-up signed off: the write-up opens from the roundup's page.
  await d.press(editorialNav(d).getByRole('link', { name: 'Roundup', exact: true }));
  await expect(page.getByRole('heading', { level: 1, name: title })).toBeVisible();
  await d.press(page.getByRole('link', { name: 'Write-up', exact: true }));
  const sections = page.getByRole('region', { name: 'Sections' }).getByRole('link');
  await expect(sections.first()).toBeVisible();
  const titles = (await sections.allTextContents()).map((t) => t.trim());
  for (const section of titles) {
    await d.press(page.getByRole('region', { name: 'Sections' }).getByRole('link', { name: section, exact: true }));
    await expect(page.getByRole('heading', { level: 1, name: section })).toBeVisible();
    await d.press(page.getByRole('button', { name: 'Sign off' }));
    await expect(page.getByText('Signed off', { exact: true })).toBeVisible();
    await d.press(page.getByRole('link', { name: '← All sections of the write-up' }));
    await expect(sections.first()).toBeVisible();
  }
}

/**
 * The editor sends the roundup to review and schedules it `secondsAhead` from now in a named zone (the job runner in
 * the server publishes it at that time, as e2e/embargo.spec.ts shows); returns the embargo instant.
 */
export async function sendToReviewAndSchedule(d: Driver, title: string, secondsAhead: number): Promise<Date> {
  const { page } = d;
  await openRoundup(d, title);
  await d.press(editorialNav(d).getByRole('link', { name: /Ready to schedule/ }));
  await expect(page.getByRole('heading', { name: 'Ready to schedule?', level: 1 })).toBeVisible();
  await d.press(page.getByRole('button', { name: 'Send to review' }));
  await expect(page.getByText('The roundup is In review.')).toBeVisible();
  await expect(page.getByText('Ready to schedule', { exact: true })).toBeVisible();

  await openRoundup(d, title);
  await openTab(d, 'Publishing');
  const at = new Date(Math.ceil((Date.now() + secondsAhead * 1000) / 1000) * 1000);
  const local = localIn(at, 'America/Los_Angeles');
  await d.date(page.getByLabel('Date'), local.date);
  await d.time(page.getByLabel('Time', { exact: true }), local.time);
  await d.fill(page.getByLabel('Time zone'), 'America/Los_Angeles');
  await expect(page.getByText(`= ${at.toISOString()} UTC`)).toBeVisible();
  await d.press(page.getByRole('button', { name: 'Schedule', exact: true }));
  await expect(page.getByTestId('schedule-summary')).toContainText(at.toISOString());
  return at;
}
