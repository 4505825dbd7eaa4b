import { expect, test } from '@playwright/test';
import { hostileStrings } from '../tests/support/hostile-strings';
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
    data: {
      maker,
      model,
      platform: `Helix-1700 ${suffix}`,
      socket: 'HX4',
      chipset: payload('javascript URL'),
      formFactor: 'atx',
      releaseDate: '2025-03-14',
      powerDesign: {
        controller: 'KV-PWM8',
        controllerPhases: 8,
        phaseMultiplication: 'doubled',
        stagesPerPhase: 1,
        vcoreStageType: 'integrated-power-stage',
        vcoreStagePart: 'KVS-60',
        vcoreStageCurrentA: 60,
        socRailStages: 2,
        otherRails: '1 stage auxiliary',
        heatsinkNotes: payload('SVG payload'),
      },
      features: {
        rearUsb: { usb2: 4, usb5g: 2, usb10g: 2, usb20g: 1, usb40g: 0 },
        frontUsbCHeader: 'usb-10g',
        lanSpeedMbps: 2500,
        wifi: 'wifi-6e',
        m2Slots: 3,
        sataPorts: 4,
        audio: '7.1 HD audio',
        ioShieldPrefitted: true,
      },
    },
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
