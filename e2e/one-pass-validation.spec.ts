import { expect, test, type Page } from '@playwright/test';
import { signInAs } from './support/sign-in';

// A form shows all its errors at once: an empty submit flags every required field in the same pass, at a common
// laptop width and on a phone. Runs against the seeded demo outlet (server/seed).

const sizes = [
  { name: 'at 1366 px', viewport: { width: 1366, height: 768 } },
  { name: 'on a phone', viewport: { width: 390, height: 844 } },
];

async function expectAllFlagged(page: Page, labels: string[]) {
  const summary = page.getByRole('alert').filter({ hasText: labels[0] });
  await expect(summary).toBeVisible();
  for (const label of labels) {
    await expect(summary, label).toContainText(`${label}:`);
    await expect(page.getByLabel(new RegExp(`^${label}`)).first()).toHaveAttribute('aria-invalid', 'true');
  }
}

for (const { name, viewport } of sizes) {
  test(`${name}, an empty New roundup form flags title, platform, prices and region in one submit`, async ({
    page,
  }) => {
    await page.setViewportSize(viewport);
    await signInAs(page, 'editor');
    await page.goto('/roundups/new');
    await page.getByRole('button', { name: 'Create roundup' }).click();
    await expectAllFlagged(page, ['Title', 'Platform', 'Lowest price', 'Highest price', 'Region']);
    await expect(page).toHaveURL(/\/roundups\/new$/);
  });

  test(`${name}, an empty New product form flags every required field in one submit`, async ({ page }) => {
    await page.setViewportSize(viewport);
    await signInAs(page, 'editor');
    await page.goto('/catalog/new');
    await page.getByRole('button', { name: 'Add to catalog' }).click();
    await expectAllFlagged(page, ['Maker', 'Model', 'Platform', 'Socket', 'Chipset', 'Form factor']);
    await expect(page).toHaveURL(/\/catalog\/new$/);
  });
}
