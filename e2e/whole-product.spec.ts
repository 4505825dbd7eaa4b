import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import sharp from 'sharp';
import { expect, test } from '@playwright/test';
import { syntheticLoggerLog } from '../shared/generators/synthetic-logger-log';
import { demoAccounts } from './support/demo-accounts';
import { linkIn, openDevInbox } from './support/dev-inbox';
import { mouseDriver } from './support/drivers';
import {
  acceptRun,
  answerBookingQuestion,
  assignAndStart,
  demoLoadName,
  editorFinishes,
  markRecorded,
  moveTo,
  openQueuedCell,
  openRoundup,
  planRoundup,
  sendToReviewAndSchedule,
  signInWith,
  signOutWith,
  writeSection,
} from './support/roundup-journey';
import { uniqueEmail, uniqueSuffix } from './support/unique';

// The whole product as a new outlet would try it, one story from a new colleague's first sign-in to a reader's
// unsubscribe: the admin adds a bench tester; the editor plans a roundup; the new tester books the bench, uploads
// the logger files and the photos; the writer drafts; the editor decides verdicts, approves the charts, signs off
// and schedules; the page goes live at its embargo (a few seconds ahead on the server's own clock and job runner, as
// in e2e/embargo.spec.ts); a reader who subscribed gets the go-live mail in the dev inbox and unsubscribes in one
// click (the RFC 8058 POST a mail program sends).

/** A full 60-minute soak (first-order rise to about 21 + riseC °C in a steady 21 °C room), logged every 2 s. */
function soakLog(seed: number, riseC: number): string {
  return syntheticLoggerLog({
    durationS: 3600,
    sampleHz: 0.5,
    seed,
    probes: [{ name: 'VRM 1', startC: 22, riseC, tauS: 300, noiseC: 0.1 }],
    ambient: { name: 'Ambient', startC: 21, noiseC: 0.05 },
  });
}

/** A quarter-hour boundary at or before now, as a datetime-local value in the browser's zone (the server's here). */
function localSlot(offsetMinutes: number): string {
  const at = new Date(Math.floor(Date.now() / 900_000) * 900_000 + offsetMinutes * 60_000);
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${at.getFullYear()}-${pad(at.getMonth() + 1)}-${pad(at.getDate())}T${pad(at.getHours())}:${pad(at.getMinutes())}`;
}

const escapeRegExp = (text: string) => text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');

let folder: string;
test.beforeAll(async () => {
  folder = await mkdtemp(path.join(tmpdir(), 'benchwire-journey-'));
});
test.afterAll(async () => {
  await rm(folder, { recursive: true, force: true });
});

// Not yet run through: the first step waits for staff invitations by mail.
test.fixme('from a new colleague to a reader: plan, bench, write, approve, go live at the embargo, mail, unsubscribe', async ({
  page,
  browser,
  playwright,
  baseURL,
}) => {
  test.setTimeout(900_000);
  const d = mouseDriver(page);
  const suffix = uniqueSuffix();
  const title = `Helix-1700 journey roundup ${suffix}`;
  const inbox = await openDevInbox(playwright, baseURL as string);

  // --- A reader subscribes to every new roundup and confirms from the mail.
  const reader = await browser.newContext();
  const readerPage = await reader.newPage();
  const readerEmail = uniqueEmail('reader');
  await readerPage.goto('/subscribe');
  await readerPage.getByLabel('E-mail address').fill(readerEmail);
  await readerPage.getByRole('checkbox', { name: /Every new roundup/ }).check();
  await readerPage.getByRole('button', { name: 'Subscribe' }).click();
  await expect(readerPage.getByRole('heading', { level: 1, name: 'Check your inbox' })).toBeVisible();
  const confirmMail = await inbox.waitForMail(readerEmail, /^Confirm your subscription/);
  await readerPage.goto(linkIn(confirmMail, '/subscribe/confirm/'));
  await readerPage.getByRole('button', { name: 'Confirm my subscription' }).click();
  await expect(readerPage.getByRole('heading', { level: 1, name: 'You are subscribed' })).toBeVisible();

  // --- The admin adds a bench tester with a first password; the tester signs in and sets their own.
  // (No invitation mail exists yet: the admin gives the first password by another way.)
  const tester = {
    displayName: `Wren Calloway ${suffix}`,
    email: uniqueEmail('tester'),
    firstPassword: `first-soak-${suffix}`,
    password: `own-soak-passphrase-${suffix}`,
  };
  await signInWith(d, demoAccounts.admin.email, demoAccounts.admin.password, demoAccounts.admin.displayName);
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Users' }).click();
  await page.getByRole('button', { name: 'New user' }).click();
  const newUser = page.getByRole('dialog', { name: 'New user' });
  await newUser.getByLabel('Name').fill(tester.displayName);
  await newUser.getByLabel('E-mail').fill(tester.email);
  await newUser.getByLabel('Role').selectOption({ label: 'Bench tester' });
  await newUser.getByLabel('First password', { exact: true }).fill(tester.firstPassword);
  await newUser.getByRole('button', { name: 'Create account' }).click();
  await expect(page.getByRole('status').filter({ hasText: `${tester.displayName} can now sign in` })).toBeVisible();
  await signOutWith(d);

  await signInWith(d, tester.email, tester.firstPassword, tester.displayName);
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Account' }).click();
  await page.getByLabel('Current password', { exact: true }).fill(tester.firstPassword);
  await page.getByLabel('New password', { exact: true }).fill(tester.password);
  await page.getByLabel('New password again', { exact: true }).fill(tester.password);
  await page.getByRole('button', { name: 'Change password' }).click();
  await expect(page.getByText('Your password is changed.')).toBeVisible();
  await signOutWith(d);

  // --- The editor plans the roundup with two boards and gives their cells to the new tester.
  await signInWith(d, demoAccounts.editor.email, demoAccounts.editor.password, demoAccounts.editor.displayName);
  const { boards } = await planRoundup(d, title, 2);
  await assignAndStart(d, boards, tester.displayName);
  await signOutWith(d);
  const cells = boards.map((board) => `${board} · ${demoLoadName}`);

  // --- The tester books a bench for both cells, uploads a logger file for each and a photo of each board.
  await signInWith(d, tester.email, tester.password, tester.displayName);
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'My bench' }).click();
  const booking = page.getByRole('form', { name: 'Book a bench' });
  // Bench B: the seeded calendar has Bench A taken around now.
  await booking.getByLabel('Bench').selectOption({ label: 'Bench B (Lab, back room)' });
  await booking.getByLabel('Starts').fill(localSlot(-15));
  await booking.getByLabel('Ends').fill(localSlot(90));
  for (const cell of cells) await booking.getByLabel(cell).check();
  await booking.getByLabel('Note').fill(`Both soaks for ${title}`);
  await booking.getByRole('button', { name: 'Book this slot' }).click();
  const anyway = booking.getByRole('button', { name: 'Book anyway' });
  const booked = page.getByRole('status').filter({ hasText: 'Booked Bench B' });
  await expect(booked.or(anyway)).toBeVisible();
  if (await anyway.isVisible()) {
    await booking.getByLabel('Why book it anyway').fill('The bench matches the plan; the room runs a degree warm.');
    await anyway.click();
  }
  await expect(booked).toBeVisible();

  for (const [index, cell] of cells.entries()) {
    const file = path.join(folder, `soak-${index + 1}.csv`);
    await writeFile(file, soakLog(index + 1, 38 + index * 6));
    await openQueuedCell(d, cell);
    await page.getByRole('button', { name: 'Upload a log' }).click();
    await page.getByLabel('Logger file').setInputFiles(file);
    await expect(page.getByRole('checkbox', { name: 'VRM 1 [°C]' })).toBeChecked();
    await page.getByLabel('Room target').fill('21');
    await page.getByRole('button', { name: 'Analyse', exact: true }).click();
    await expect(page.getByRole('region', { name: 'Result' })).toBeVisible();
    const details = page.getByRole('form', { name: 'Run details' });
    await details.getByLabel('Firmware (BIOS) version').fill('1.04');
    await details.getByRole('button', { name: 'Submit the run' }).click();
    await answerBookingQuestion(d, details, 'Submit the run');
    await expect(page.getByText('Run submitted')).toBeVisible();
    await markRecorded(d);

    const photo = path.join(folder, `board-${index + 1}.jpg`);
    await writeFile(
      photo,
      await sharp({ create: { width: 800, height: 600, channels: 3, background: { r: 40, g: 60, b: 50 } } })
        .jpeg()
        .toBuffer(),
    );
    await page.getByRole('link', { name: `Photos of ${boards[index]}` }).click();
    const upload = page.getByRole('form', { name: 'Add a photo' });
    await upload.getByLabel('Photo file').setInputFiles(photo);
    await upload.getByLabel('What it shows').selectOption({ label: 'Board overview' });
    await upload.getByLabel('Alt text').fill(`The ${boards[index]} from above, heatsinks fitted`);
    await upload.getByLabel('Caption').fill('As it came out of the box');
    await upload.getByRole('button', { name: 'Add the photo' }).click();
    await expect(page.getByText('Photo added as number 1.')).toBeVisible({ timeout: 30_000 });
  }
  await signOutWith(d);

  // --- The editor accepts both runs and moves the roundup to Writing.
  await signInWith(d, demoAccounts.editor.email, demoAccounts.editor.password, demoAccounts.editor.displayName);
  for (const cell of cells) await acceptRun(d, title, cell);
  await openRoundup(d, title);
  await moveTo(d, 'Writing');
  await signOutWith(d);

  // --- The writer drafts a board's section.
  await signInWith(d, demoAccounts.writer.email, demoAccounts.writer.password, demoAccounts.writer.displayName);
  await writeSection(d, title, boards[0], 'Both power stages stayed well inside their rating through the hour.');
  await signOutWith(d);

  // --- The editor decides verdicts, approves every chart, signs off the write-up and schedules 25 s ahead.
  await signInWith(d, demoAccounts.editor.email, demoAccounts.editor.password, demoAccounts.editor.displayName);
  await editorFinishes(d, title, boards);
  const at = await sendToReviewAndSchedule(d, title, 25);

  // Before the embargo a reader finds nothing; at the time the job runner publishes it.
  await readerPage.goto('/read');
  await expect(readerPage.getByRole('heading', { level: 1 })).toBeVisible();
  expect(await readerPage.content()).not.toContain(title);
  await expect(page.getByText('The roundup is live')).toBeVisible({ timeout: 60_000 });
  expect(Date.now()).toBeGreaterThanOrEqual(at.getTime());
  // The browser keeps the home page it saw a minute; a reload revalidates it (as in e2e/embargo.spec.ts).
  await readerPage.goto('/read');
  await readerPage.reload();
  await readerPage.getByRole('link', { name: title }).click();
  await expect(readerPage.getByRole('heading', { level: 1, name: title })).toBeVisible();
  const publicPath = new URL(readerPage.url()).pathname;

  // --- The go-live mail reaches the subscriber and links to the page.
  const goLive = await inbox.waitForMail(readerEmail, new RegExp(`^New roundup: ${escapeRegExp(title)}$`), 90_000);
  expect(linkIn(goLive, '/read/roundups/')).toContain(publicPath);

  // One click on the mail's unsubscribe link: a page with one button (link scanners only GET), then done. It is
  // the address the List-Unsubscribe header gives a mail program for the RFC 8058 one-click POST.
  const header = (name: string) => goLive.headers.find((h) => h.name.toLowerCase() === name.toLowerCase())?.value;
  expect(header('List-Unsubscribe-Post')).toBe('List-Unsubscribe=One-Click');
  const oneClick = /<(https?:\/\/[^>]+\/unsubscribe\/[^>]+)>/.exec(header('List-Unsubscribe') ?? '')?.[1];
  expect(oneClick, 'the List-Unsubscribe header names the one-click address').toBeTruthy();
  const unsubscribeLink = linkIn(goLive, '/unsubscribe/');
  expect(new URL(oneClick as string).pathname).toBe(unsubscribeLink);
  await readerPage.goto(unsubscribeLink);
  await expect(readerPage.getByRole('heading', { level: 1, name: 'Unsubscribe?' })).toBeVisible();
  await readerPage.getByRole('button', { name: 'Unsubscribe' }).click();
  await expect(readerPage.getByRole('heading', { level: 1, name: 'You are unsubscribed' })).toBeVisible();
  await readerPage.goto(linkIn(goLive, '/subscribe/manage/'));
  await expect(readerPage.getByText('You are unsubscribed: no mailings are sent to this address.')).toBeVisible();

  // A mail program's one-click POST (no cookie, no Origin) to the header's address answers the same page.
  const mailProgram = await playwright.request.newContext({ baseURL });
  const posted = await mailProgram.post(new URL(oneClick as string).pathname, {
    form: { 'List-Unsubscribe': 'One-Click' },
  });
  expect(posted.status()).toBe(200);
  expect(await posted.text()).toContain('You are unsubscribed');
  await mailProgram.dispose();

  await reader.close();
  await inbox.api.dispose();
});
