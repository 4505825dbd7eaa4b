import { expect, test } from '@playwright/test';
import { hostileStrings } from '../tests/support/hostile-strings';
import { productRequest } from '../tests/support/plan-requests';
import { invitedWelcomeLink } from './support/invitations';
import { signInAs } from './support/sign-in';
import { uniqueSuffix } from './support/unique';

/**
 * Text that looks like markup is shown as text: a board whose maker and model carry script tags, event attributes
 * and an SVG payload appears on the catalog list and its own page literally, and none of it runs (each payload
 * would set window.__hostile or open a dialog).
 */
const payload = (name: string) => hostileStrings.find((entry) => entry.name === name)!.value;

test('markup in a product’s names is shown as text on the catalog pages and never runs', async ({ page }) => {
  const dialogs: string[] = [];
  page.on('dialog', async (dialog) => {
    dialogs.push(dialog.message());
    await dialog.dismiss();
  });
  await signInAs(page, 'editor');
  const suffix = uniqueSuffix();
  const maker = `${payload('event attribute')} ${suffix}`;
  const model = `${payload('script tag')} ${payload('SVG payload')}`;
  const created = await page.request.post('/api/catalog/products', {
    headers: { Origin: new URL(page.url()).origin },
    data: productRequest(maker, model, `Helix-1700 ${suffix}`, {
      chipset: payload('javascript URL'),
      powerDesign: { ...productRequest(maker, model, '').powerDesign, heatsinkNotes: payload('SVG payload') },
    }),
  });
  expect(created.status(), await created.text()).toBe(201);
  const { id } = (await created.json()) as { id: number };

  await page.goto(`/catalog?search=${encodeURIComponent(suffix)}`);
  await expect(page.getByRole('main')).toContainText(maker);
  await page.goto(`/catalog/${id}`);
  await expect(page.getByRole('heading', { level: 1 })).toContainText('<script>');
  await expect(page.getByText(payload('javascript URL')).first()).toBeVisible();
  await page.waitForLoadState('networkidle');

  expect(await page.evaluate(() => (window as unknown as { __hostile?: unknown }).__hostile)).toBeUndefined();
  expect(dialogs).toEqual([]);
  // No element was made from the text: no injected image, SVG or script in the page.
  expect(await page.locator('img[src="x"], svg[onload], script:not([src])').count()).toBe(0);
  // A javascript: text never becomes a link.
  expect(await page.locator('a[href^="javascript:"]').count()).toBe(0);
});

test('markup in an invited person’s name is shown as text on the welcome page and never runs', async ({
  page,
  baseURL,
}) => {
  const dialogs: string[] = [];
  page.on('dialog', async (dialog) => {
    dialogs.push(dialog.message());
    await dialog.dismiss();
  });
  const name = `${payload('script tag')} ${payload('event attribute')}`.slice(0, 120);
  const { path } = await invitedWelcomeLink(baseURL as string, 'tester', name);
  await page.goto(path);
  await expect(page.getByRole('heading', { level: 1 })).toContainText('<script>');
  await page.waitForLoadState('networkidle');
  expect(await page.evaluate(() => (window as unknown as { __hostile?: unknown }).__hostile)).toBeUndefined();
  expect(dialogs).toEqual([]);
  expect(await page.locator('img[src="x"], svg[onload], script:not([src])').count()).toBe(0);
});
