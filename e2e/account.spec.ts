import { expect, test } from '@playwright/test';
import { mainNavigation, signIn } from './support/sign-in';
import { createStaffAccount, onOwnAccountPage } from './support/staff-accounts';

test('a wrong current password is shown beside its field, and the right one changes the password', async ({
  page,
  playwright,
  baseURL,
}) => {
  const account = await onOwnAccountPage(page, playwright, baseURL!, 'writer');

  const current = page.getByLabel('Current password', { exact: true });
  await current.fill('not-my-password');
  await page.getByLabel('New password', { exact: true }).fill('a-new-soak-passphrase');
  await page.getByLabel('New password again', { exact: true }).fill('a-new-soak-passphrase');
  await page.getByRole('button', { name: 'Change password' }).click();
  await expect(current).toHaveAttribute('aria-invalid', 'true');
  await expect(page.getByText('This is not your current password.').first()).toBeVisible();
  await expect(page.getByLabel('New password', { exact: true })).toHaveValue('a-new-soak-passphrase');

  await current.fill(account.password);
  await page.getByRole('button', { name: 'Change password' }).click();
  await expect(page.getByText('Your password is changed.')).toBeVisible();
  await expect(current).toHaveValue('');
});

test('a session on another device can be revoked from the account page', async ({
  page,
  browser,
  playwright,
  baseURL,
}) => {
  const account = await createStaffAccount(playwright, baseURL!, 'tester');
  const otherDevice = await browser.newContext();
  const otherPage = await otherDevice.newPage();
  await signIn(otherPage, account.email, account.password, account.displayName);

  await signIn(page, account.email, account.password, account.displayName);
  await mainNavigation(page).getByRole('link', { name: 'Account' }).click();
  const sessions = page.getByRole('table', { name: 'Your sessions' });
  await expect(sessions.getByRole('row')).toHaveCount(3); // header, this device, the other one
  await expect(sessions.getByText('This device', { exact: true })).toHaveCount(1);
  await sessions.getByRole('button', { name: /^Revoke/ }).click();
  await expect(sessions.getByRole('row')).toHaveCount(2);

  // The other device is sent to sign in at its next request.
  await otherPage.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Account' }).click();
  await expect(otherPage).toHaveURL(/\/sign-in\?next=%2Faccount$/);
  await otherDevice.close();
});
