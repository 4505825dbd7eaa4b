import { expect, test } from '@playwright/test';
import { demoAccounts } from './support/demo-accounts';
import { submitSignIn } from './support/sign-in';

test('a wrong password shows the clear message and keeps what was typed', async ({ page }) => {
  await page.goto('/sign-in');
  await submitSignIn(page, demoAccounts.writer.email, 'not-the-password');

  await expect(page.getByRole('alert')).toContainText('That e-mail and password do not match an active account.');
  await expect(page).toHaveURL(/\/sign-in$/);
  await expect(page.getByLabel('E-mail')).toHaveValue(demoAccounts.writer.email);
  await expect(page.getByLabel('Password', { exact: true })).toHaveValue('not-the-password');
});

test('an e-mail that is not an address is caught before anything is sent', async ({ page }) => {
  await page.goto('/sign-in');
  await submitSignIn(page, 'not-an-address', 'whatever');
  await expect(page.getByLabel('E-mail')).toHaveAttribute('aria-invalid', 'true');
  await expect(page.getByText('Enter an e-mail address such as name@example.org.').first()).toBeVisible();
});
