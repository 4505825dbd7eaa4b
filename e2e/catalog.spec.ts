import { expect, test, type Page } from '@playwright/test';
import { demoAccounts } from './support/demo-accounts';
import { mainNavigation, signInAs } from './support/sign-in';
import { uniqueSuffix } from './support/unique';

const header =
  'maker,model,platform,socket,chipset,form_factor,vrm_controller,controller_phases,phase_multiplication,' +
  'stages_per_phase,vcore_stage_type,vcore_stage_current_a,price_region,price_currency,price_amount,price_observed_on,price_source';

function csvRow(maker: string, model: string, formFactor: string) {
  return `${maker},${model},Helix-1700,HX4,HX-B50,${formFactor},KV-PWM8,8,doubled,1,integrated-power-stage,60,DE,EUR,189.90,2026-06-01,Brightmoor Direct`;
}

async function openCatalog(page: Page) {
  await mainNavigation(page).getByRole('link', { name: 'Catalog' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Catalog' })).toBeVisible();
}

async function searchCatalog(page: Page, text: string) {
  await page.getByRole('searchbox', { name: 'Search' }).fill(text);
  await page.getByRole('searchbox', { name: 'Search' }).press('Enter');
  await expect(page).toHaveURL(new RegExp(`q=${encodeURIComponent(text).replace(/%20/g, '(\\+|%20)')}`));
}

test('an editor imports a CSV: a bad row is shown by row and column and nothing is saved; fixed, it imports', async ({
  page,
}) => {
  const maker = `Tidewell ${uniqueSuffix()}`;
  const csv = [header, csvRow(maker, 'TW Calm', 'atx'), csvRow(maker, 'TW Loud', 'wide-atx')].join('\n');
  await signInAs(page, 'editor');
  await openCatalog(page);
  await page.getByRole('link', { name: 'Import CSV' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Import products from CSV' })).toBeVisible();

  await page
    .getByLabel('CSV file')
    .setInputFiles({ name: 'boards.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
  await page.getByRole('button', { name: 'Check the file' }).click();

  await expect(page.getByRole('alert').filter({ hasText: 'Nothing has been saved' })).toContainText(
    '1 problem in 1 row',
  );
  const problem = page.getByRole('region', { name: 'Problems found in the file' }).getByRole('row').nth(1);
  await expect(problem.getByRole('cell').nth(0)).toHaveText('3');
  await expect(problem.getByRole('cell').nth(1)).toHaveText('form_factor');
  await expect(page.getByRole('button', { name: /Confirm import/ })).toHaveCount(0);

  // Nothing reached the catalog.
  await openCatalog(page);
  await searchCatalog(page, maker);
  await expect(page.getByText('No products match')).toBeVisible();

  // Back to the import: fix the bad row in the text box, check again, confirm.
  await page.getByRole('link', { name: 'Import CSV' }).click();
  await page.getByLabel('Pasted text').check();
  await page.getByLabel('CSV text').fill(csv.replace('wide-atx', 'micro-atx'));
  await page.getByRole('button', { name: 'Check the file' }).click();
  await expect(page.getByRole('heading', { name: '3 · Confirm the import' })).toBeVisible();
  await expect(page.getByRole('region', { name: 'Rows in the file' })).toContainText(`${maker} TW Loud`);
  await page.getByRole('button', { name: 'Confirm import of 2 rows' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'Imported' })).toContainText('2 products added');

  await page.getByRole('link', { name: 'Open the catalog' }).click();
  await searchCatalog(page, maker);
  const rows = page.getByRole('row').filter({ hasText: maker });
  await expect(rows).toHaveCount(2);
  const loud = rows.filter({ hasText: 'TW Loud' });
  await expect(loud).toContainText('Micro-ATX');
  await expect(loud).toContainText('8 × 2 → 16');
  await expect(loud).toContainText('€189.90');
});

test('a writer reads the catalog and a product page without any editing controls', async ({
  page,
  playwright,
  baseURL,
}) => {
  const maker = `Ostrel ${uniqueSuffix()}`;
  const api = await playwright.request.newContext({ baseURL, extraHTTPHeaders: { Origin: baseURL as string } });
  try {
    const editor = demoAccounts.editor;
    expect(
      (await api.post('/api/auth/sign-in', { data: { email: editor.email, password: editor.password } })).ok(),
    ).toBe(true);
    const created = await api.post('/api/catalog/products', {
      data: {
        maker,
        model: 'OW Quiet',
        platform: 'Helix-1700',
        socket: 'HX4',
        chipset: 'HX-B50',
        formFactor: 'mini-itx',
      },
    });
    expect(created.status(), await created.text()).toBe(201);
  } finally {
    await api.dispose();
  }

  await signInAs(page, 'writer');
  await openCatalog(page);
  await searchCatalog(page, maker);
  const row = page.getByRole('row').filter({ hasText: maker });
  await expect(row).toContainText('Mini-ITX');
  await expect(page.getByRole('link', { name: 'New product' })).toHaveCount(0);
  await expect(page.getByRole('link', { name: 'Import CSV' })).toHaveCount(0);
  await expect(page.getByRole('link', { name: /^Edit / })).toHaveCount(0);
  await expect(page.getByRole('columnheader', { name: 'Actions' })).toHaveCount(0);

  await row.getByRole('link', { name: 'OW Quiet' }).click();
  await expect(page.getByRole('heading', { level: 1, name: `${maker} OW Quiet` })).toBeVisible();
  await expect(page.getByRole('heading', { name: 'Price history' })).toBeVisible();
  await expect(page.getByRole('link', { name: 'Edit product' })).toHaveCount(0);
  await expect(page.getByRole('button', { name: 'Archive' })).toHaveCount(0);
  await expect(page.getByRole('button', { name: 'Delete' })).toHaveCount(0);
  await expect(page.getByRole('form', { name: 'Add a price' })).toHaveCount(0);
});

test('deleting a product that a roundup uses is refused with the reason, and archiving is offered instead', async ({
  page,
  playwright,
  baseURL,
}) => {
  const suffix = uniqueSuffix();
  const maker = `Brightmoor ${suffix}`;
  const api = await playwright.request.newContext({ baseURL, extraHTTPHeaders: { Origin: baseURL as string } });
  try {
    const editor = demoAccounts.editor;
    const post = async (path: string, data: unknown) => {
      const response = await api.post(path, { data });
      expect(response.ok(), await response.text()).toBe(true);
      return (await response.json()) as { id: number };
    };
    await post('/api/auth/sign-in', { email: editor.email, password: editor.password });
    const platform = `Helix-1700 ${suffix}`;
    const product = await post('/api/catalog/products', {
      maker,
      model: 'BM Anchor',
      platform,
      socket: 'HX4',
      chipset: 'HX-B50',
      formFactor: 'atx',
    });
    const profile = await post('/api/bench-profiles', {
      name: `Open bench ${suffix}`,
      caseAndFans: 'Open test bench, one 120 mm fan',
      cooler: 'Tidewell 360 liquid cooler',
      psu: 'Ostrel Works 1000 W',
      memory: '2 × 16 GB at 6000 MT/s',
      roomTempTargetC: 21,
      roomTempToleranceC: 1,
      probeType: 'Type K thermocouple',
      probePlacement: 'Board rear under the V-core stages',
      requiredSoakMinutes: 60,
    });
    const load = await post('/api/load-configurations', {
      name: `Stock all-core ${suffix}`,
      cpuDescription: 'Helix HX-16 sample',
      settingsMode: 'stock',
      expectedPackagePowerW: 230,
      coreVoltageV: 1.25,
      soakMinutes: 60,
    });
    const roundup = await post('/api/roundups', {
      title: `Helix-1700 boards ${suffix}`,
      platform,
      priceBand: { minMinor: 15000, maxMinor: 22000, currency: 'EUR', region: 'DE' },
      targetPublishDate: new Date(Date.now() + 60 * 86_400_000).toISOString().slice(0, 10),
      timeZone: 'Europe/Berlin',
      benchProfileId: profile.id,
      loadConfigurationIds: [load.id],
    });
    await post(`/api/roundups/${roundup.id}/entries`, { productId: product.id, kind: 'tested' });
  } finally {
    await api.dispose();
  }

  await signInAs(page, 'editor');
  await openCatalog(page);
  await searchCatalog(page, maker);
  await page.getByRole('link', { name: 'BM Anchor', exact: true }).click();
  await page.getByRole('button', { name: 'Delete' }).click();
  await page
    .getByRole('dialog', { name: `Delete ${maker} BM Anchor?` })
    .getByRole('button', { name: 'Delete product' })
    .click();

  const refused = page.getByRole('dialog', { name: 'This product cannot be deleted' });
  await expect(refused).toContainText('is in 1 roundup');
  await expect(refused).toContainText('Archive it instead');
  await refused.getByRole('button', { name: 'Archive instead' }).click();
  await expect(refused).toBeHidden();
  await expect(page.getByRole('status').filter({ hasText: 'is archived' })).toBeVisible();
  await expect(page.getByRole('button', { name: 'Restore to catalog' })).toBeVisible();
});
