import { expect, type APIRequestContext, type PlaywrightWorkerArgs } from '@playwright/test';
import { planAssignedCell, type AssignedCell, type SendRequest } from '../../tests/support/plan-requests';
import type { Role } from '../../shared/schemas/common';
import { demoAccounts } from './demo-accounts';
import { uniqueSuffix } from './unique';

/** An API session of a demo account, sending a same-site Origin like the browser does. */
export async function demoApi(
  playwright: PlaywrightWorkerArgs['playwright'],
  baseURL: string,
  role: Role,
): Promise<APIRequestContext> {
  const api = await playwright.request.newContext({ baseURL, extraHTTPHeaders: { Origin: baseURL } });
  const account = demoAccounts[role];
  const signIn = await api.post('/api/auth/sign-in', { data: { email: account.email, password: account.password } });
  expect(signIn.ok(), await signIn.text()).toBe(true);
  return api;
}

/** Requests through an API session; each answer must be a success, and its JSON is returned. */
export function sender(api: APIRequestContext): SendRequest {
  return async (method, path, body) => {
    const response = method === 'GET' ? await api.get(path) : await api.post(path, { data: body });
    expect(response.ok(), `${method} ${path}: ${response.status()} ${await response.text()}`).toBe(true);
    return response.json();
  };
}

/**
 * As the demo editor, through the API: a roundup on the bench with one board and one stock load soaking 60 minutes,
 * its cell assigned to the demo tester and no booking. Names carry a suffix no other run uses.
 */
export async function prepareAssignedCell(
  playwright: PlaywrightWorkerArgs['playwright'],
  baseURL: string,
  names: { profileName: string; title: string; model: string },
): Promise<AssignedCell & { suffix: string; cellLabel: string }> {
  const api = await demoApi(playwright, baseURL, 'editor');
  try {
    const send = sender(api);
    const { testers } = (await send('GET', '/api/testers')) as { testers: { id: number; displayName: string }[] };
    const tester = testers.find((person) => person.displayName === demoAccounts.tester.displayName);
    expect(tester).toBeTruthy();
    const suffix = uniqueSuffix();
    const cell = await planAssignedCell(send, { suffix, testerId: tester!.id, ...names });
    return { ...cell, suffix, cellLabel: `${cell.maker} ${cell.model} · ${cell.loadName}` };
  } finally {
    await api.dispose();
  }
}
