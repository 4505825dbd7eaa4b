import { expect, type Page, type PlaywrightWorkerArgs } from '@playwright/test';
import type { Role } from '../../shared/schemas/common';
import { demoAccounts } from './demo-accounts';
import { mainNavigation, signIn } from './sign-in';
import { uniqueEmail, uniqueSuffix } from './unique';

export interface StaffAccount {
  id: number;
  email: string;
  password: string;
  displayName: string;
  role: Role;
}

/**
 * Creates a fresh account through the API as the demo admin, for specs that change an account's own state
 * (password, sessions) and must not disturb the shared demo staff.
 */
export async function createStaffAccount(
  playwright: PlaywrightWorkerArgs['playwright'],
  baseURL: string,
  role: Role,
): Promise<StaffAccount> {
  // State-changing requests must name this site as their origin, as a browser would.
  const api = await playwright.request.newContext({ baseURL, extraHTTPHeaders: { Origin: baseURL } });
  try {
    const admin = demoAccounts.admin;
    const signIn = await api.post('/api/auth/sign-in', { data: { email: admin.email, password: admin.password } });
    expect(signIn.status()).toBe(200);
    const suffix = uniqueSuffix();
    const account = {
      email: uniqueEmail(role),
      password: `soak-time-${suffix}`,
      displayName: `Probe ${role} ${suffix}`,
      role,
    };
    const created = await api.post('/api/users', { data: account });
    expect(created.status()).toBe(201);
    const { id } = (await created.json()) as { id: number };
    return { id, ...account };
  } finally {
    await api.dispose();
  }
}

/** A fresh account of the role, signed in on the page and opened on its own Account page. */
export async function onOwnAccountPage(
  page: Page,
  playwright: PlaywrightWorkerArgs['playwright'],
  baseURL: string,
  role: Role,
): Promise<StaffAccount> {
  const account = await createStaffAccount(playwright, baseURL, role);
  await signIn(page, account.email, account.password, account.displayName);
  await mainNavigation(page).getByRole('link', { name: 'Account' }).click();
  return account;
}
