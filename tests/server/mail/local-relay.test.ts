import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import nodemailer from 'nodemailer';
import { databaseRelayStore, startLocalRelay, type LocalRelay } from '../../../server/mail/local-relay';
import { signedIn, testApp, testEnv, uniqueEmail, type TestApp } from '../support/test-app';

// A 1×1 PNG (the smallest valid image: PNG specification, ISO/IEC 15948, signature + IHDR + IDAT + IEND).
const onePixelPng = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==',
  'base64',
);

let relay: LocalRelay;
let app: TestApp;

beforeAll(async () => {
  relay = await startLocalRelay({ store: databaseRelayStore(testEnv().DATABASE_URL) });
  app = await testApp({ SMTP_URL: relay.url, LOCAL_MAIL_RELAY: 'true' });
});
afterAll(async () => {
  await relay.close();
});

function transport() {
  return nodemailer.createTransport({ url: relay.url, pool: true, maxConnections: 2 });
}

describe('the local mail relay', () => {
  it('keeps a message once per Message-ID, refuses bounce.invalid with 550 and fails on purpose with 451', async () => {
    const mailer = transport();
    const to = uniqueEmail('reader');
    const messageId = `<relay-test-${Date.now()}@benchwire.test>`;
    const mail = { from: 'Benchwire <mail@benchwire.test>', to, subject: 'Twice', text: 'Same id', messageId };
    const before = { ...relay.stats };
    await mailer.sendMail(mail);
    await mailer.sendMail(mail);
    expect(relay.stats.stored - before.stored).toBe(1);
    expect(relay.stats.duplicates - before.duplicates).toBe(1);

    // RFC 5321 §4.2.1: 5yz is a permanent negative reply, 4yz a transient one.
    const bounced = await mailer
      .sendMail({ ...mail, to: 'nobody@bounce.invalid', messageId: undefined })
      .catch((e: { responseCode?: number }) => e);
    expect((bounced as { responseCode?: number }).responseCode).toBe(550);

    relay.failTemporarilyAfter(1, 2);
    await mailer.sendMail({ ...mail, messageId: undefined, subject: 'Accepted before the fault' });
    const deferred = await mailer
      .sendMail({ ...mail, messageId: undefined })
      .catch((e: { responseCode?: number }) => e);
    expect((deferred as { responseCode?: number }).responseCode).toBe(451);
    await mailer.sendMail({ ...mail, messageId: undefined }).catch(() => null);
    await mailer.sendMail({ ...mail, messageId: undefined, subject: 'After the fault' });
    mailer.close();
  });

  it('shows an admin the messages, with inline images as data: addresses; other roles are refused', async () => {
    const mailer = transport();
    const to = uniqueEmail('inbox');
    await mailer.sendMail({
      from: 'Benchwire <mail@benchwire.test>',
      to,
      subject: 'Chart inside',
      text: 'The plain part',
      html: '<p>The chart</p><img src="cid:chart@benchwire" alt="Chart">',
      attachments: [{ filename: 'chart.png', content: onePixelPng, cid: 'chart@benchwire', contentType: 'image/png' }],
    });
    mailer.close();

    const { agent } = await signedIn(app, 'admin');
    const list = await agent.get(`/api/dev-inbox?to=${encodeURIComponent(to)}`);
    expect(list.status).toBe(200);
    expect(list.body.enabled).toBe(true);
    expect(list.body.messages).toHaveLength(1);
    const detail = await agent.get(`/api/dev-inbox/${list.body.messages[0].id}`);
    expect(detail.status).toBe(200);
    expect(detail.body.text.trim()).toBe('The plain part');
    expect(detail.body.html).toContain(`src="data:image/png;base64,${onePixelPng.toString('base64')}"`);
    expect(detail.body.headers.find((h: { name: string }) => h.name === 'Subject').value).toBe('Chart inside');
    // The frame's page: the same HTML under a policy of its own (inline styles and data: images, nothing that runs).
    const page = await agent.get(`/api/dev-inbox/${list.body.messages[0].id}/html`);
    expect(page.status).toBe(200);
    expect(page.headers['content-type']).toMatch(/^text\/html/);
    expect(page.text).toBe(detail.body.html);
    const policy = page.headers['content-security-policy'];
    expect(policy).toContain("default-src 'none'");
    expect(policy).toContain("style-src 'unsafe-inline'");
    expect(policy).toMatch(/(^|; )sandbox( |;|$)/);
    expect(policy).not.toMatch(/script-src/);

    const { agent: editor } = await signedIn(app, 'editor');
    expect((await editor.get('/api/dev-inbox')).status).toBe(403);
    expect((await editor.get(`/api/dev-inbox/${list.body.messages[0].id}/html`)).status).toBe(403);
  });

  it('has no dev inbox when mail goes through a real relay', async () => {
    const realRelayApp = await testApp({ SMTP_URL: 'smtp://relay.example:587' });
    const { agent } = await signedIn(realRelayApp, 'admin');
    const list = await agent.get('/api/dev-inbox');
    expect(list.body).toEqual({ enabled: false, total: 0, messages: [] });
    expect((await agent.get('/api/dev-inbox/1')).status).toBe(404);
  });

  it('keeps the message whole: its Message-ID and encoded subject read back as sent', async () => {
    const mailer = transport();
    const to = uniqueEmail('whole');
    const sent = await mailer.sendMail({ from: 'a@benchwire.test', to, subject: 'Ünïcode subject', text: 'Body' });
    mailer.close();
    const { agent } = await signedIn(app, 'admin');
    const list = await agent.get(`/api/dev-inbox?to=${encodeURIComponent(to)}`);
    expect(list.body.messages[0].subject).toBe('Ünïcode subject');
    const detail = await agent.get(`/api/dev-inbox/${list.body.messages[0].id}`);
    expect(detail.body.messageId).toBe(sent.messageId);
  });
});
