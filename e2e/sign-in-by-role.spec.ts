import { expect, test } from '@playwright/test';
import { roles } from '../shared/schemas/common';
import { demoAccounts } from './support/demo-accounts';
import { mainNavigation, signInAs, signOut } from './support/sign-in';

for (const role of roles) {
  const account = demoAccounts[role];

  test(`a${role === 'admin' || role === 'editor' ? 'n' : ''} ${role} signs in, sees the navigation of the role, and signs out`, async ({
    page,
  }) => {
    await signInAs(page, role);

    await expect(page).toHaveURL(/\/$/);
    await expect(page.getByRole('heading', { level: 1 })).toHaveText(`Welcome, ${account.displayName}`);
    await expect(page.getByRole('banner')).toContainText(account.roleLabel);

    const navigation = mainNavigation(page);
    await expect(navigation.getByRole('link', { name: 'Dashboard' })).toBeVisible();
    await expect(navigation.getByRole('link', { name: 'Account' })).toBeVisible();
    if (role === 'admin') {
      await expect(navigation.getByRole('link', { name: 'Users' })).toBeVisible();
    } else {
      await expect(navigation.getByRole('link', { name: 'Users' })).toHaveCount(0);
    }

    if (role === 'tester') {
      await expect(page.getByText('Bench safety', { exact: true })).toBeVisible();
    }

    await signOut(page);

    // The session is gone: a staff page sends the visitor back to sign in, remembering where they wanted to go.
    await page.goto('/account');
    await expect(page).toHaveURL(/\/sign-in\?next=%2Faccount$/);
  });
}

test('an editor who opens the users page is told the role cannot open it', async ({ page }) => {
  await signInAs(page, 'editor');
  await page.goto('/users');
  await expect(page.getByText('Your role cannot open this page')).toBeVisible();
  await expect(page.getByRole('table')).toHaveCount(0);
});

test('after signing in, the user lands on the page they asked for', async ({ page }) => {
  await page.goto('/account');
  await expect(page).toHaveURL(/\/sign-in\?next=%2Faccount$/);
  const account = demoAccounts.writer;
  await page.getByLabel('E-mail').fill(account.email);
  await page.getByLabel('Password', { exact: true }).fill(account.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/account$/);
  await expect(page.getByRole('heading', { level: 1, name: 'Account' })).toBeVisible();
  await expect(page.getByText('This device', { exact: true })).toBeVisible();
});
