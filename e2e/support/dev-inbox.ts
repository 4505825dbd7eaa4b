import { expect, type APIRequestContext, type PlaywrightWorkerArgs } from '@playwright/test';
import { demoAccounts } from './demo-accounts';

export interface InboxMessage {
  id: number;
  to: string;
  subject: string;
  text: string | null;
  html: string | null;
  headers: { name: string; value: string }[];
}

/**
 * The local relay's dev inbox (GET /api/dev-inbox, admin only), read through its own API session as the demo admin,
 * so a spec can open the mail a person would receive without disturbing the browser it drives.
 */
export async function openDevInbox(
  playwright: PlaywrightWorkerArgs['playwright'],
  baseURL: string,
): Promise<{
  api: APIRequestContext;
  waitForMail: (to: string, subject: RegExp, timeout?: number) => Promise<InboxMessage>;
}> {
  const api = await playwright.request.newContext({ baseURL, extraHTTPHeaders: { Origin: baseURL } });
  const admin = demoAccounts.admin;
  const signIn = await api.post('/api/auth/sign-in', { data: { email: admin.email, password: admin.password } });
  expect(signIn.status(), await signIn.text()).toBe(200);

  /** The newest message to `to` whose subject matches, waiting for the mail worker and the relay. */
  async function waitForMail(to: string, subject: RegExp, timeout = 45_000): Promise<InboxMessage> {
    let found: number | null = null;
    await expect
      .poll(
        async () => {
          const answer = await api.get(`/api/dev-inbox?to=${encodeURIComponent(to)}&limit=50`);
          const inbox = (await answer.json()) as { enabled: boolean; messages: { id: number; subject: string }[] };
          expect(inbox.enabled, 'the e2e server runs with the local relay and its dev inbox').toBe(true);
          found = inbox.messages.find((m) => subject.test(m.subject))?.id ?? null;
          return found;
        },
        { timeout, intervals: [250, 500, 1000] },
      )
      .not.toBeNull();
    const message = await api.get(`/api/dev-inbox/${found}`);
    expect(message.status()).toBe(200);
    return (await message.json()) as InboxMessage;
  }

  return { api, waitForMail };
}

/** The site-relative address of the first link in a mail's plain text whose path starts with `prefix`. */
export function linkIn(message: InboxMessage, prefix: string): string {
  const text = `${message.text ?? ''}\n${message.html ?? ''}`;
  const match = new RegExp(`https?://[^\\s"'<>]+?(${prefix.replace(/[/.]/g, '\\$&')}[^\\s"'<>]*)`).exec(text);
  expect(match, `a link to ${prefix}… in the mail "${message.subject}"`).not.toBeNull();
  return (match as RegExpExecArray)[1].replace(/&amp;/g, '&');
}
