import { expect, type Page } from '@playwright/test';
import type { Role } from '../../shared/schemas/common';
import { demoAccounts } from './demo-accounts';

/** Fills and sends the sign-in form; does not wait for the outcome. */
export async function submitSignIn(page: Page, email: string, password: string) {
  if (!new URL(page.url(), 'http://placeholder').pathname.startsWith('/sign-in')) await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

/** Signs in and waits until the staff frame shows the user. */
export async function signIn(page: Page, email: string, password: string, displayName?: string) {
  await submitSignIn(page, email, password);
  await expect(page.getByRole('button', { name: 'Sign out' })).toBeVisible();
  if (displayName) await expect(page.getByRole('banner')).toContainText(displayName);
}

export async function signInAs(page: Page, role: Role) {
  const account = demoAccounts[role];
  await signIn(page, account.email, account.password, account.displayName);
  return account;
}

export async function signOut(page: Page) {
  await page.getByRole('button', { name: 'Sign out' }).click();
  await expect(page).toHaveURL(/\/sign-in$/);
  await expect(page.getByRole('heading', { name: 'Sign in' })).toBeVisible();
}

export function mainNavigation(page: Page) {
  return page.getByRole('navigation', { name: 'Main' });
}
