import { expect, test, type Locator, type Page } from '@playwright/test';
import { signInAs } from './support/sign-in';

// Wide tables at a common laptop width and on a phone: the column that names each row stays in view while the
// table scrolls sideways, the chosen columns are remembered, and the tester's moves are reachable on a phone.
// Runs against the seeded demo outlet (server/seed).

const laptop = { width: 1366, height: 768 };
const phone = { width: 390, height: 844 };

async function box(locator: Locator) {
  const found = await locator.boundingBox();
  if (!found) throw new Error('element has no box (not rendered)');
  return found;
}

async function openCatalog(page: Page) {
  await page.goto('/catalog');
  await expect(page.getByRole('heading', { level: 1, name: 'Catalog' })).toBeVisible();
  return page.getByRole('region', { name: 'Catalog products' });
}

test('at 1366 px the catalog keeps the model and Edit in view while scrolling sideways, and remembers the chosen columns', async ({
  page,
}) => {
  await page.setViewportSize(laptop);
  await signInAs(page, 'editor');
  const table = await openCatalog(page);

  // The table area is never taller than the window, so its sideways scrollbar can be brought into view.
  await table.evaluate((element) => element.scrollIntoView({ block: 'end' }));
  const area = await box(table);
  expect(area.y).toBeGreaterThanOrEqual(0);
  expect(area.y + area.height).toBeLessThanOrEqual(laptop.height + 1);

  // Scrolled all the way to the right: the model names and the Edit links are still inside the table area.
  const scrolled = await table.evaluate((element) => {
    element.scrollLeft = element.scrollWidth;
    return element.scrollLeft;
  });
  expect(scrolled).toBeGreaterThan(0);
  const model = table.getByRole('rowheader').first();
  const edit = table.getByRole('link', { name: /^Edit / }).first();
  for (const cell of [model, edit]) {
    const place = await box(cell);
    expect(place.x).toBeGreaterThanOrEqual(area.x - 1);
    expect(place.x + place.width).toBeLessThanOrEqual(area.x + area.width + 1);
  }

  // Choose columns: Chipset off, Wi-Fi on; after a reload the choice still holds.
  const chooser = page.locator('summary', { hasText: 'Columns' });
  await chooser.click();
  await page.getByRole('checkbox', { name: 'Chipset' }).uncheck();
  await page.getByRole('checkbox', { name: 'Wi-Fi' }).check();
  await expect(table.getByRole('columnheader', { name: 'Chipset' })).toHaveCount(0);
  await expect(table.getByRole('columnheader', { name: 'Wi-Fi' })).toHaveCount(1);

  await page.reload();
  await expect(page.getByRole('heading', { level: 1, name: 'Catalog' })).toBeVisible();
  await expect(table.getByRole('columnheader', { name: 'Chipset' })).toHaveCount(0);
  await expect(table.getByRole('columnheader', { name: 'Wi-Fi' })).toHaveCount(1);
  await expect(table.getByRole('columnheader', { name: /Model/ })).toHaveCount(1);

  // Reset brings the defaults back.
  await chooser.click();
  await page.getByRole('button', { name: 'Reset' }).click();
  await expect(table.getByRole('columnheader', { name: 'Chipset' })).toHaveCount(1);
});

test('at 1366 px the roundups list shows its loans in full and the dashboard tiles open it filtered', async ({
  page,
}) => {
  await page.setViewportSize(laptop);
  await signInAs(page, 'editor');

  await page.getByRole('link', { name: /^On the bench: / }).click();
  await expect(page).toHaveURL(/\/roundups\?state=on-the-bench$/);
  await expect(page.getByRole('combobox', { name: 'State' })).toHaveValue('on-the-bench');
  const table = page.getByRole('region', { name: 'Roundups' });
  const rows = table.getByRole('row');
  await expect(rows).not.toHaveCount(1);
  // However long the other cells, the last column can be scrolled fully into view.
  await table.evaluate((element) => (element.scrollLeft = element.scrollWidth));
  for (const badge of await table.getByRole('cell').filter({ hasText: 'overdue' }).all()) {
    await expect(badge).toHaveText(/^\d+ overdue$/);
    const area = await box(table);
    const place = await box(badge);
    expect(place.x + place.width).toBeLessThanOrEqual(area.x + area.width + 1);
  }
});

test('on a phone the tester reaches the queue moves without scrolling sideways, and the caution folds once read', async ({
  page,
}) => {
  await page.setViewportSize(phone);
  await signInAs(page, 'tester');
  // The dashboard shows the bench safety caution open the first time in this session.
  await expect(page.getByText('Bench safety', { exact: true })).toBeVisible();
  await expect(page.getByText(/get hot enough to burn/).first()).toBeVisible();

  await page.goto('/my-bench');
  await expect(page.getByRole('heading', { level: 1, name: 'My bench' })).toBeVisible();

  // Read once: back on the dashboard it is folded to its title, and one press opens it again.
  await page.goto('/');
  const caution = page.locator('details', { hasText: 'Bench safety' });
  await expect(caution.getByText('Bench safety', { exact: true })).toBeVisible();
  await expect(caution.getByText(/get hot enough to burn/)).toBeHidden();
  await caution.getByText('Bench safety', { exact: true }).click();
  await expect(caution.getByText(/get hot enough to burn/)).toBeVisible();

  await page.goto('/my-bench');
  await expect(page.getByRole('heading', { level: 1, name: 'My bench' })).toBeVisible();
  const move = page.getByRole('button', { name: /^Start run: / }).first();
  await expect(move).toBeVisible();
  const place = await box(move);
  expect(place.x).toBeGreaterThanOrEqual(0);
  expect(place.x + place.width).toBeLessThanOrEqual(phone.width);
  // No product is named with its maker twice.
  await expect(page.getByText(/\b([A-Z][a-z]+) \1\b/)).toHaveCount(0);
});

test('at 1366 px the rule beside the navigation runs to the bottom of a long page', async ({ page }) => {
  await page.setViewportSize(laptop);
  await signInAs(page, 'editor');
  await openCatalog(page);
  const column = page.getByRole('navigation', { name: 'Main' }).locator('..');
  await expect(column).toHaveCSS('border-right-style', 'solid');
  // Scrolled to the very end, the column carrying the rule ends where the page's main area ends.
  await page.evaluate(() => window.scrollTo(0, document.documentElement.scrollHeight));
  const main = await box(page.locator('main#main'));
  const rule = await box(column);
  expect(main.height).toBeGreaterThan(laptop.height);
  expect(Math.abs(rule.y + rule.height - (main.y + main.height))).toBeLessThanOrEqual(1);
});
