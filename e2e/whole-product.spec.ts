import sharp from 'sharp';
import { expect, test, type BrowserContext } from '@playwright/test';
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
  writeSection,
} from './support/roundup-journey';
import { uniqueEmail, uniqueSuffix } from './support/unique';
import { specFolder, writeInto } from './support/temp-folder';

// The whole product as a new outlet would try it, one story from new colleagues' first sign-in to a reader's
// unsubscribe: the admin invites an editor, a bench tester and a writer by mail, and each sets a password from the
// link in a browser of their own; the editor plans a roundup; the tester books the bench, uploads the logger files
// and the photos; the writer drafts; the editor decides verdicts, approves the charts, signs off and schedules; the
// page goes live at its embargo (a few seconds ahead on the server's own clock and job runner, as in
// e2e/embargo.spec.ts); a reader who subscribed gets the go-live mail in the dev inbox and unsubscribes in one click
// (the mail's link, and the RFC 8058 POST a mail program sends).

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

/** A quarter-hour boundary at or before now, moved by `offsetMinutes`, as a datetime-local value in the browser's zone (the server's here). */
function localSlot(offsetMinutes: number): string {
  const at = new Date(Math.floor(Date.now() / 900_000) * 900_000 + offsetMinutes * 60_000);
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${at.getFullYear()}-${pad(at.getMonth() + 1)}-${pad(at.getDate())}T${pad(at.getHours())}:${pad(at.getMinutes())}`;
}

const escapeRegExp = (text: string) => text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');

const folder = specFolder('benchwire-journey-');

test('from new colleagues to a reader: invite, plan, bench, write, approve, go live at the embargo, mail, unsubscribe', async ({
  page,
  browser,
  playwright,
  baseURL,
}) => {
  test.setTimeout(900_000);
  const suffix = uniqueSuffix();
  const title = `Helix-1700 journey roundup ${suffix}`;
  const inbox = await openDevInbox(playwright, baseURL as string);
  const contexts: BrowserContext[] = [];

  // --- A reader subscribes to every new roundup and confirms from the mail.
  const reader = await browser.newContext();
  contexts.push(reader);
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

  // --- The admin invites an editor, a bench tester and a writer by mail. Each opens the link from the mail in a
  // browser of their own, chooses a password and is signed in; from here on each works in that browser.
  const admin = mouseDriver(page);
  await signInWith(admin, demoAccounts.admin.email, demoAccounts.admin.password, demoAccounts.admin.displayName);
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Users' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Users' })).toBeVisible();

  async function invite(roleLabel: string, displayName: string) {
    const email = uniqueEmail(roleLabel.toLowerCase().replace(/\W+/g, '-'));
    await page.getByRole('button', { name: 'New user' }).click();
    const dialog = page.getByRole('dialog', { name: 'New user' });
    await dialog.getByLabel('Name').fill(displayName);
    await dialog.getByLabel('E-mail').fill(email);
    await dialog.getByLabel('Role').selectOption({ label: roleLabel });
    await dialog.getByRole('button', { name: 'Send invitation' }).click();
    await expect(dialog).toBeHidden();
    await expect(page.getByRole('status').filter({ hasText: `Invitation sent to ${displayName}` })).toBeVisible();
    return { email, displayName, roleLabel };
  }

  async function accept(invited: { email: string; displayName: string; roleLabel: string }) {
    const mail = await inbox.waitForMail(invited.email, /invited you to Benchwire/);
    const context = await browser.newContext();
    contexts.push(context);
    const theirPage = await context.newPage();
    await theirPage.goto(linkIn(mail, '/welcome/'));
    await expect(theirPage.getByRole('heading', { level: 1, name: `Welcome, ${invited.displayName}` })).toBeVisible();
    const password = `own-passphrase-${invited.roleLabel.length}-${suffix}`;
    await theirPage.getByLabel('New password', { exact: true }).fill(password);
    await theirPage.getByLabel('New password again').fill(password);
    await theirPage.getByRole('button', { name: 'Set password and sign in' }).click();
    await expect(theirPage.getByRole('button', { name: 'Sign out' })).toBeVisible();
    await expect(theirPage.getByRole('banner')).toContainText(invited.displayName);
    await expect(theirPage.getByRole('banner')).toContainText(invited.roleLabel);
    return mouseDriver(theirPage);
  }

  const invitedEditor = await invite('Editor', `Ione Prestwick ${suffix}`);
  const invitedTester = await invite('Bench tester', `Wren Calloway ${suffix}`);
  const invitedWriter = await invite('Writer', `Marit Selkirk ${suffix}`);
  const editor = await accept(invitedEditor);
  const tester = await accept(invitedTester);
  const writer = await accept(invitedWriter);
  // The admin's table now shows the three as active.
  await page.reload();
  for (const invited of [invitedEditor, invitedTester, invitedWriter]) {
    await expect(page.getByRole('row').filter({ hasText: invited.email })).toContainText('Active');
  }

  // --- The editor plans the roundup with two boards and gives their cells to the new tester.
  const { boards } = await planRoundup(editor, title, 2);
  await assignAndStart(editor, boards, invitedTester.displayName);
  const cells = boards.map((board) => `${board} · ${demoLoadName}`);

  // --- The tester books a bench for both cells, uploads a logger file for each and a photo of each board.
  const bench = tester.page;
  await bench.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'My bench' }).click();
  const booking = bench.getByRole('form', { name: 'Book a bench' });
  // Bench B: the seeded calendar has Bench A taken around now.
  await booking.getByLabel('Bench').selectOption({ label: 'Bench B (Lab, back room)' });
  await booking.getByLabel('Starts').fill(localSlot(-15));
  await booking.getByLabel('Ends').fill(localSlot(90));
  for (const cell of cells) await booking.getByLabel(cell).check();
  await booking.getByLabel('Note').fill(`Both soaks for ${title}`);
  await booking.getByRole('button', { name: 'Book this slot' }).click();
  const anyway = booking.getByRole('button', { name: 'Book anyway' });
  const booked = bench.getByRole('status').filter({ hasText: 'Booked Bench B' });
  const taken = booking.getByRole('alert').filter({ hasText: 'Bench B is already booked' });
  await expect(booked.or(anyway).or(taken)).toBeVisible();
  if (await taken.isVisible()) {
    // Only when this database saw an earlier run of this journey within the hour: the tester books a later slot,
    // and the runs below then say why they fall outside the bookings.
    const later = (2 + Math.floor(Math.random() * 300)) * 1440;
    await booking.getByLabel('Starts').fill(localSlot(later));
    await booking.getByLabel('Ends').fill(localSlot(later + 120));
    await booking.getByRole('button', { name: /^Book (this slot|anyway)$/ }).click();
    await expect(booked.or(anyway)).toBeVisible();
  }
  if (await anyway.isVisible()) {
    await booking.getByLabel('Why book it anyway').fill('The bench matches the plan; the room runs a degree warm.');
    await anyway.click();
  }
  await expect(booked).toBeVisible();

  for (const [index, cell] of cells.entries()) {
    const file = await writeInto(folder(), `soak-${index + 1}.csv`, soakLog(index + 1, 38 + index * 6));
    await openQueuedCell(tester, cell);
    await bench.getByRole('button', { name: 'Upload a log' }).click();
    await bench.getByLabel('Logger file').setInputFiles(file);
    await expect(bench.getByRole('checkbox', { name: 'VRM 1 [°C]' })).toBeChecked();
    await bench.getByLabel('Room target').fill('21');
    await bench.getByRole('button', { name: 'Analyse', exact: true }).click();
    await expect(bench.getByRole('region', { name: 'Result' })).toBeVisible();
    const details = bench.getByRole('form', { name: 'Run details' });
    await details.getByLabel('Firmware (BIOS) version').fill('1.04');
    await details.getByRole('button', { name: 'Submit the run' }).click();
    await answerBookingQuestion(tester, details, 'Submit the run');
    await expect(bench.getByText('Run submitted')).toBeVisible();
    await markRecorded(tester);

    const photo = await writeInto(
      folder(),
      `board-${index + 1}.jpg`,
      await sharp({ create: { width: 800, height: 600, channels: 3, background: { r: 40, g: 60, b: 50 } } })
        .jpeg()
        .toBuffer(),
    );
    await bench.getByRole('link', { name: `Photos of ${boards[index]}` }).click();
    const upload = bench.getByRole('form', { name: 'Add a photo' });
    await upload.getByLabel('Photo file').setInputFiles(photo);
    await upload.getByLabel('What it shows').selectOption({ label: 'Board overview' });
    await upload.getByLabel('Alt text').fill(`The ${boards[index]} from above, heatsinks fitted`);
    await upload.getByLabel('Caption').fill('As it came out of the box');
    await upload.getByRole('button', { name: 'Add the photo' }).click();
    await expect(bench.getByText('Photo added as number 1.')).toBeVisible({ timeout: 30_000 });
  }

  // --- The editor accepts both runs and moves the roundup to Writing.
  for (const cell of cells) await acceptRun(editor, title, cell);
  await openRoundup(editor, title);
  await moveTo(editor, 'Writing');

  // --- The writer drafts a board's section.
  await writeSection(writer, title, boards[0], 'Both power stages stayed well inside their rating through the hour.');

  // --- The editor decides verdicts, approves every chart, signs off the write-up and schedules 25 s ahead.
  await editorFinishes(editor, title, boards);
  const at = await sendToReviewAndSchedule(editor, title, 25);

  // Before the embargo a reader finds nothing; at the time the job runner publishes it.
  await readerPage.goto('/read');
  await expect(readerPage.getByRole('heading', { level: 1 })).toBeVisible();
  expect(await readerPage.content()).not.toContain(title);
  await expect(editor.page.getByText('The roundup is live')).toBeVisible({ timeout: 60_000 });
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

  for (const context of contexts) await context.close();
  await inbox.api.dispose();
});
