import { expect, test } from '@playwright/test';
import { demoAccounts, type DemoAccount } from './support/demo-accounts';
import { keyboardDriver, type Driver } from './support/drivers';
import {
  acceptRun,
  assignAndStart,
  demoLoadName,
  editorFinishes,
  moveTo,
  openRoundup,
  planRoundup,
  recordManualRun,
  sendToReviewAndSchedule,
  signInWith,
  signOutWith,
  writeSection,
} from './support/roundup-journey';
import { uniqueSuffix } from './support/unique';

// The whole roundup workflow driven with the keyboard alone: every control is reached with Tab or Shift+Tab and
// worked with Enter, Space, the arrow keys and typing (e2e/support/keyboard.ts; no click, no fill). A control Tab
// cannot reach, or a place the focus cannot leave, fails the test where it happens. Going to the sign-in page is
// typing its address.

const signInAs = (d: Driver, account: DemoAccount) =>
  signInWith(d, account.email, account.password, account.displayName);

test('an editor, a tester and a writer take a roundup from plan to schedule with the keyboard only', async ({
  page,
}) => {
  test.setTimeout(600_000);
  const d = keyboardDriver(page);
  const title = `Helix-1700 keyboard roundup ${uniqueSuffix()}`;

  // The editor plans the roundup, adds two boards, gives their cells to the tester and puts it on the bench.
  await signInAs(d, demoAccounts.editor);
  const { boards } = await planRoundup(d, title, 2);
  await assignAndStart(d, boards, demoAccounts.tester.displayName);
  await signOutWith(d);

  // The tester enters each run by hand and marks the cells recorded.
  await signInAs(d, demoAccounts.tester);
  const peaks = ['62.4', '66.8'];
  for (const [index, board] of boards.entries()) {
    await recordManualRun(d, `${board} · ${demoLoadName}`, peaks[index]);
  }
  await signOutWith(d);

  // The editor accepts both runs and moves the roundup to Writing.
  await signInAs(d, demoAccounts.editor);
  for (const board of boards) await acceptRun(d, title, `${board} · ${demoLoadName}`);
  await openRoundup(d, title);
  await moveTo(d, 'Writing');
  await signOutWith(d);

  // The writer drafts a board's section and asks for review.
  await signInAs(d, demoAccounts.writer);
  await writeSection(d, title, boards[0], 'The rear heatsink is thin, yet the stages stayed cool through the soak.');
  await signOutWith(d);

  // The editor decides the verdicts, approves the charts, signs off the write-up and schedules the roundup.
  await signInAs(d, demoAccounts.editor);
  await editorFinishes(d, title, boards);
  const at = await sendToReviewAndSchedule(d, title, 20);
  await expect(page.getByText('The roundup is live')).toBeVisible({ timeout: 60_000 });
  expect(Date.now()).toBeGreaterThanOrEqual(at.getTime());
});
