import { expect, request } from '@playwright/test';
import type { Role } from '../../shared/schemas/common';
import { demoAccounts } from './demo-accounts';
import { linkIn, type InboxMessage } from './dev-inbox';
import { uniqueEmail, uniqueSuffix } from './unique';

/**
 * Invites a new colleague through the API as the demo admin and returns the site-relative welcome link from the
 * mail in the dev inbox, for specs that need the welcome page without driving the users screen.
 */
export async function invitedWelcomeLink(
  baseURL: string,
  role: Role,
  name?: string,
): Promise<{ email: string; displayName: string; path: string }> {
  const api = await request.newContext({ baseURL, extraHTTPHeaders: { Origin: baseURL } });
  try {
    const admin = demoAccounts.admin;
    expect(
      (await api.post('/api/auth/sign-in', { data: { email: admin.email, password: admin.password } })).status(),
    ).toBe(200);
    const email = uniqueEmail(`invited-${role}`);
    const displayName = name ?? `Invited ${role} ${uniqueSuffix()}`;
    const created = await api.post('/api/users', { data: { email, displayName, role } });
    expect(created.status(), await created.text()).toBe(201);
    let message: InboxMessage | null = null;
    await expect
      .poll(
        async () => {
          const inbox = (await (await api.get(`/api/dev-inbox?to=${encodeURIComponent(email)}`)).json()) as {
            messages: { id: number }[];
          };
          if (inbox.messages.length === 0) return false;
          message = (await (await api.get(`/api/dev-inbox/${inbox.messages[0].id}`)).json()) as InboxMessage;
          return true;
        },
        { timeout: 45_000, intervals: [250, 500, 1000] },
      )
      .toBe(true);
    return { email, displayName, path: linkIn(message as unknown as InboxMessage, '/welcome/') };
  } finally {
    await api.dispose();
  }
}
