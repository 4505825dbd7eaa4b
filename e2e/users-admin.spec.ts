import { expect, test, type Page } from '@playwright/test';
import { demoAccounts } from './support/demo-accounts';
import { linkIn, openDevInbox } from './support/dev-inbox';
import { mainNavigation, signIn, signInAs, signOut, submitSignIn } from './support/sign-in';
import { uniqueEmail, uniqueSuffix } from './support/unique';

interface NewAccount {
  displayName: string;
  email: string;
  password: string;
  roleLabel: string;
}

function newAccount(roleLabel: string): NewAccount {
  const suffix = uniqueSuffix();
  return {
    displayName: `Probe Person ${suffix}`,
    email: uniqueEmail('person'),
    password: `bench-soak-${suffix}`,
    roleLabel,
  };
}

async function openUsers(page: Page) {
  await mainNavigation(page).getByRole('link', { name: 'Users' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Users' })).toBeVisible();
}

/** Opens the New user dialog and fills in the name, e-mail and role of the account. */
async function fillNewUser(page: Page, account: NewAccount) {
  await page.getByRole('button', { name: 'New user' }).click();
  const dialog = page.getByRole('dialog', { name: 'New user' });
  await dialog.getByLabel('Name').fill(account.displayName);
  await dialog.getByLabel('E-mail').fill(account.email);
  await dialog.getByLabel('Role').selectOption({ label: account.roleLabel });
  return dialog;
}

async function createUser(page: Page, account: NewAccount) {
  const dialog = await fillNewUser(page, account);
  await dialog.getByRole('radio', { name: /Set a first password/ }).check();
  await dialog.getByLabel('First password', { exact: true }).fill(account.password);
  await dialog.getByRole('button', { name: 'Create account' }).click();
  return dialog;
}

test('an admin creates a user who can then sign in', async ({ page }) => {
  const account = newAccount('Writer');
  await signInAs(page, 'admin');
  await openUsers(page);

  const dialog = await createUser(page, account);
  await expect(dialog).toBeHidden();
  await expect(page.getByRole('status').filter({ hasText: `${account.displayName} can now sign in` })).toBeVisible();
  const row = page.getByRole('row').filter({ hasText: account.email });
  await expect(row).toContainText(account.displayName);
  await expect(row).toContainText('Writer');
  await expect(row).toContainText('Active');

  await signOut(page);
  await signIn(page, account.email, account.password, account.displayName);
  await expect(page.getByRole('banner')).toContainText('Writer');
  await expect(mainNavigation(page).getByRole('link', { name: 'Users' })).toHaveCount(0);
});

test('creating a user with an e-mail already in use shows the error beside the field and keeps the form', async ({
  page,
}) => {
  const account = { ...newAccount('Editor'), email: demoAccounts.writer.email };
  await signInAs(page, 'admin');
  await openUsers(page);

  const dialog = await createUser(page, account);
  const email = dialog.getByLabel('E-mail');
  await expect(email).toHaveAttribute('aria-invalid', 'true');
  await expect(dialog.getByText('Another account already uses this e-mail address.').first()).toBeVisible();
  await expect(dialog.getByLabel('Name')).toHaveValue(account.displayName);
  await expect(email).toHaveValue(account.email);
  await expect(dialog.getByLabel('First password', { exact: true })).toHaveValue(account.password);
});

test('a deactivated user cannot sign in', async ({ page }) => {
  const account = newAccount('Bench tester');
  await signInAs(page, 'admin');
  await openUsers(page);
  await expect(await createUser(page, account)).toBeHidden();

  await page.getByRole('button', { name: `Edit ${account.displayName}` }).click();
  const editDialog = page.getByRole('dialog', { name: `Edit ${account.displayName}` });
  await editDialog.getByRole('button', { name: 'Deactivate account' }).click();
  const confirm = page.getByRole('dialog', { name: `Deactivate ${account.displayName}?` });
  await expect(confirm).toContainText('signed out at once, on every device');
  await confirm.getByRole('button', { name: 'Deactivate', exact: true }).click();
  await expect(confirm).toBeHidden();
  await expect(editDialog.getByRole('button', { name: 'Reactivate account' })).toBeVisible();
  await editDialog.getByRole('button', { name: 'Close' }).last().click();
  await expect(page.getByRole('row').filter({ hasText: account.email })).toContainText('Deactivated');

  await signOut(page);
  await submitSignIn(page, account.email, account.password);
  await expect(page.getByRole('alert')).toContainText('That e-mail and password do not match an active account.');
  await expect(page).toHaveURL(/\/sign-in$/);
});

test('an admin invites a colleague by mail; the link sets their password and signs them in, once', async ({
  page,
  browser,
  playwright,
  baseURL,
}) => {
  const account = newAccount('Bench tester');
  await signInAs(page, 'admin');
  await openUsers(page);

  const dialog = await fillNewUser(page, account);
  // Inviting is the default way in.
  await expect(dialog.getByRole('radio', { name: /Send an invitation/ })).toBeChecked();
  await expect(dialog.getByLabel('First password', { exact: true })).toHaveCount(0);
  await dialog.getByRole('button', { name: 'Send invitation' }).click();
  await expect(dialog).toBeHidden();
  await expect(page.getByRole('status').filter({ hasText: `Invitation sent to ${account.displayName}` })).toBeVisible();
  const row = page.getByRole('row').filter({ hasText: account.email });
  await expect(row).toContainText('Invited — not yet accepted');
  await expect(row).toContainText('expires');

  const { api, waitForMail } = await openDevInbox(playwright, baseURL as string);
  const mail = await waitForMail(account.email, /invited you to Benchwire/);
  await api.dispose();
  expect(mail.text).toContain('Bench tester');
  const welcome = linkIn(mail, '/welcome/');

  // The invited person opens the link in a browser of their own.
  const theirs = await browser.newContext({ baseURL });
  const invited = await theirs.newPage();
  await invited.goto(welcome);
  await expect(invited.getByRole('heading', { level: 1, name: `Welcome, ${account.displayName}` })).toBeVisible();
  await expect(invited.getByText(account.email)).toBeVisible();
  await invited.getByLabel('New password', { exact: true }).fill(account.password);
  await invited.getByLabel('New password again').fill(`${account.password}-typo`);
  await invited.getByRole('button', { name: 'Set password and sign in' }).click();
  await expect(invited.getByText('The two passwords do not match.').first()).toBeVisible();
  await expect(invited.getByLabel('New password', { exact: true })).toHaveValue(account.password);
  await invited.getByLabel('New password again').fill(account.password);
  await invited.getByRole('button', { name: 'Set password and sign in' }).click();

  await expect(invited).toHaveURL(/\/$/);
  await expect(invited.getByRole('banner')).toContainText(account.displayName);
  await expect(invited.getByRole('banner')).toContainText('Bench tester');
  await expect(mainNavigation(invited).getByRole('link', { name: 'My bench' })).toBeVisible();
  await expect(mainNavigation(invited).getByRole('link', { name: 'Users' })).toHaveCount(0);
  await theirs.close();

  // The link works once.
  const later = await browser.newContext({ baseURL });
  const again = await later.newPage();
  await again.goto(welcome);
  await expect(again.getByRole('heading', { level: 1, name: 'This invitation has been used' })).toBeVisible();
  await later.close();

  await page.reload();
  await expect(page.getByRole('row').filter({ hasText: account.email })).toContainText('Active');
});

test('an admin sends an invitation again or withdraws it, from the users table', async ({ page }) => {
  const account = newAccount('Writer');
  await signInAs(page, 'admin');
  await openUsers(page);
  const dialog = await fillNewUser(page, account);
  await dialog.getByRole('button', { name: 'Send invitation' }).click();
  await expect(dialog).toBeHidden();

  await page.getByRole('button', { name: `Send the invitation to ${account.displayName} again` }).click();
  await expect(page.getByRole('status').filter({ hasText: 'any earlier link no longer works' })).toBeVisible();

  await page.getByRole('button', { name: `Withdraw the invitation to ${account.displayName}` }).click();
  const confirm = page.getByRole('dialog', { name: `Withdraw the invitation to ${account.displayName}?` });
  await confirm.getByRole('button', { name: 'Withdraw invitation' }).click();
  await expect(confirm).toBeHidden();
  await expect(page.getByRole('row').filter({ hasText: account.email })).toContainText('Invitation withdrawn');
});
