import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { SubscriberEntity, MailSuppressionEntity } from '../../../server/entities/mail.entities';
import { enqueueGoLiveMailing } from '../../../server/mail/outbox';
import { RoundupEntity } from '../../../server/entities/roundup.entity';
import { client, signedIn, TEST_HOST, TEST_ORIGIN, uniqueEmail } from '../support/test-app';
import { approveAllCharts, roundupWithResults } from '../editorial/support/editorial-fixtures';
import {
  sendAll,
  closeMailTestContext,
  createRoundup,
  linkIn,
  mailTestContext,
  messagesTo,
  rawHeader,
  withMailTestContext,
  type MailTestContext,
} from './mail-support';

let ctx: MailTestContext;
let everyRoundup: number;

beforeAll(async () => {
  ctx = await mailTestContext();
  const categories = (await request(ctx.app).get('/api/mail-categories')).body.categories;
  everyRoundup = categories.find((c: { name: string }) => c.name === 'Every new roundup').id;
});
afterAll(async () => {
  await closeMailTestContext(ctx);
});

const site = 'https://results.soaksheet.example';

async function signUp(email: string, categoryIds = [everyRoundup]) {
  return client(ctx.app).post('/api/subscribers').send({ email, categoryIds });
}

/** Signs up and returns the token of the confirmation link in the mail that follows. */
async function signUpForConfirmation(email: string) {
  await signUp(email);
  await sendAll(ctx.services.mailSender);
  const [confirmation] = await messagesTo(email);
  return linkIn(confirmation.text, `${site}/subscribe/confirm/`).split('/').pop() as string;
}

/** Signs up and opens the confirmation link from the mail; returns the self-service token. */
async function subscribeAndConfirm(email: string) {
  const token = await signUpForConfirmation(email);
  const confirmed = await client(ctx.app).post(`/subscribe/confirm/${token}`);
  expect(confirmed.status).toBe(200);
  return { token, manage: /\/subscribe\/manage\/([^"]+)"/.exec(confirmed.text)![1] };
}

async function publishAndSend() {
  const roundup = await createRoundup();
  await ctx.dataSource.transaction((manager) => enqueueGoLiveMailing(manager, roundup.id));
  await sendAll(ctx.services.mailSender);
  return roundup;
}

describe('double opt-in', () => {
  it('answers the same for a new, a pending and a confirmed address, and never downgrades a confirmed one', async () => {
    const known = uniqueEmail('known');
    await subscribeAndConfirm(known);
    const fresh = await signUp(uniqueEmail('fresh'));
    const again = await signUp(known);
    expect(fresh.status).toBe(202);
    expect(again.status).toBe(202);
    expect(again.body).toEqual(fresh.body);
    const row = await ctx.dataSource.getRepository(SubscriberEntity).findOneByOrFail({ email: known });
    expect(row.status).toBe('confirmed');
    // The owner of the confirmed address hears about the attempt, with their self-service link.
    await sendAll(ctx.services.mailSender);
    const mails = await messagesTo(known);
    expect(mails.at(-1)!.subject).toMatch(/already subscribed/);
  });

  it('a pending address gets no go-live mail; a confirmed one gets exactly one with both unsubscribe headers', async () => {
    const pending = uniqueEmail('pending');
    await signUp(pending);
    const confirmed = uniqueEmail('confirmed');
    await subscribeAndConfirm(confirmed);
    const roundup = await publishAndSend();

    const pendingMail = (await messagesTo(pending)).filter((m) => m.subject?.includes(roundup.title));
    expect(pendingMail).toHaveLength(0);
    const goLive = (await messagesTo(confirmed)).filter((m) => m.subject?.includes(roundup.title));
    expect(goLive).toHaveLength(1);
    const [mail] = goLive;
    // RFC 2369 / RFC 8058: one List-Unsubscribe with the HTTPS URI first, and the one-click marker.
    expect(rawHeader(mail, 'list-unsubscribe')).toMatch(
      /^<https:\/\/results\.soaksheet\.example\/unsubscribe\/[^>]+>, <mailto:/,
    );
    expect(rawHeader(mail, 'list-unsubscribe-post')).toBe('List-Unsubscribe=One-Click');
    expect(mail.text).toContain(`${site}/read/roundups/${roundup.id}-`);
    expect(mail.html).toContain('Read the results');
  });

  it('a confirmation link works once and expires', async () => {
    const token = await signUpForConfirmation(uniqueEmail('once'));
    expect((await client(ctx.app).get(`/subscribe/confirm/${token}`)).status).toBe(200);
    expect((await client(ctx.app).post(`/subscribe/confirm/${token}`)).status).toBe(200);
    expect((await client(ctx.app).post(`/subscribe/confirm/${token}`)).status).toBe(410);
    expect((await client(ctx.app).post('/api/subscribers/confirm').send({ token })).status).toBe(410);

    const lateToken = await signUpForConfirmation(uniqueEmail('late'));
    // 48 hours and a minute later (the link's stated lifetime is 48 hours).
    const later = new Date(Date.now() + 48 * 3_600_000 + 60_000);
    await expect(ctx.services.subscribers.confirm(lateToken, later)).rejects.toMatchObject({
      code: 'confirm_link_expired',
    });
  });

  it('a filled-in honeypot changes nothing and sends nothing, with the same answer', async () => {
    const email = uniqueEmail('bot');
    const answer = await client(ctx.app)
      .post('/api/subscribers')
      .send({ email, categoryIds: [everyRoundup], website: 'https://spam.example' });
    expect(answer.status).toBe(202);
    expect(await ctx.dataSource.getRepository(SubscriberEntity).findOneBy({ email })).toBeNull();
  });

  it('the form works without JavaScript and keeps what was typed when something is wrong', async () => {
    const page = await client(ctx.app).get('/subscribe');
    expect(page.status).toBe(200);
    expect(page.text).toContain('name="website"');
    const wrong = await client(ctx.app).post('/subscribe').type('form').send({ email: 'not-an-address' });
    expect(wrong.status).toBe(422);
    expect(wrong.text).toContain('value="not-an-address"');
    expect(wrong.text).toContain('Choose at least one subject.');
    const email = uniqueEmail('form');
    const ok = await client(ctx.app)
      .post('/subscribe')
      .type('form')
      .send(`email=${encodeURIComponent(email)}&categoryIds=${everyRoundup}`);
    expect(ok.status).toBe(200);
    expect(ok.text).toContain('Check your inbox');
  });

  it('limits sign-ups per client address', async () => {
    await withMailTestContext({ SUBSCRIBE_LIMIT_PER_IP: '2' }, async (limited) => {
      const statuses = [];
      for (let i = 0; i < 3; i++) {
        statuses.push(
          (
            await client(limited.app)
              .post('/api/subscribers')
              .send({ email: uniqueEmail('rate'), categoryIds: [everyRoundup] })
          ).status,
        );
      }
      expect(statuses).toEqual([202, 202, 429]);
    });
  });
});

describe('one-click unsubscribe (RFC 8058)', () => {
  it('a GET only shows a page; a POST without session, cookie or Origin unsubscribes, answering 200, not a redirect', async () => {
    const email = uniqueEmail('oneclick');
    await subscribeAndConfirm(email);
    await publishAndSend();
    const goLive = (await messagesTo(email)).at(-1)!;
    const url = new URL(/^<([^>]+)>/.exec(rawHeader(goLive, 'list-unsubscribe') as string)![1]);

    const shown = await request(ctx.app).get(url.pathname).set('Host', TEST_HOST);
    expect(shown.status).toBe(200);
    expect(shown.text).toContain('Unsubscribe?');
    expect((await ctx.dataSource.getRepository(SubscriberEntity).findOneByOrFail({ email })).status).toBe('confirmed');

    // What a mail program sends: the form body, no cookie, no Origin.
    const posted = await request(ctx.app)
      .post(url.pathname)
      .set('Host', TEST_HOST)
      .type('form')
      .send('List-Unsubscribe=One-Click');
    expect(posted.status).toBe(200);
    expect(posted.headers.location).toBeUndefined();
    expect((await ctx.dataSource.getRepository(SubscriberEntity).findOneByOrFail({ email })).status).toBe(
      'unsubscribed',
    );

    // And the next mailing skips the address.
    const roundup = await publishAndSend();
    expect((await messagesTo(email)).filter((m) => m.subject?.includes(roundup.title))).toHaveLength(0);
  });

  it('a forged token unsubscribes no one; other form posts still need a same-site Origin', async () => {
    expect(
      (await request(ctx.app).post('/unsubscribe/1.1.AAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAA').set('Host', TEST_HOST)).status,
    ).toBe(404);
    const noOrigin = await request(ctx.app)
      .post('/subscribe')
      .set('Host', TEST_HOST)
      .type('form')
      .send(`email=${encodeURIComponent(uniqueEmail('csrf'))}&categoryIds=${everyRoundup}`);
    expect(noOrigin.status).toBe(403);
    const crossSite = await request(ctx.app)
      .post('/subscribe')
      .set('Host', TEST_HOST)
      .set('Origin', 'https://elsewhere.example')
      .type('form')
      .send('email=a%40b.example');
    expect(crossSite.status).toBe(403);
    expect(TEST_ORIGIN).toContain(TEST_HOST);
  });
});

describe('self-service from the signed link', () => {
  it('exports the subscriber’s data as JSON and erases it, keeping only a salted hash that blocks mail', async () => {
    const email = uniqueEmail('erase');
    const { manage } = await subscribeAndConfirm(email);
    const exported = await client(ctx.app).get(`/subscribe/manage/${manage}/export.json`);
    expect(exported.status).toBe(200);
    expect(exported.body.email).toBe(email);
    expect(exported.body.categories).toEqual(['Every new roundup']);
    expect(exported.body.mail.length).toBeGreaterThan(0);

    expect((await client(ctx.app).post(`/subscribe/manage/${manage}/erase`).type('form').send('')).status).toBe(422);
    expect(
      (await client(ctx.app).post(`/subscribe/manage/${manage}/erase`).type('form').send('confirm=yes')).status,
    ).toBe(200);
    expect(await ctx.dataSource.getRepository(SubscriberEntity).findOneBy({ email })).toBeNull();
    const outboxMentions: unknown[] = await ctx.dataSource.query(
      'SELECT id FROM mail_outbox WHERE recipient = ? OR JSON_SEARCH(payload, "one", ?) IS NOT NULL',
      [email, `%${email}%`],
    );
    expect(outboxMentions).toEqual([]);
    const hash = await ctx.services.linkSecret.addressHash(email);
    expect(hash).not.toContain(email.split('@')[0]);
    expect(await ctx.dataSource.getRepository(MailSuppressionEntity).findOneBy({ addressHash: hash })).toMatchObject({
      reason: 'erased',
    });
    expect((await client(ctx.app).get(`/subscribe/manage/${manage}`)).status).toBe(404);
  });

  it('saves chosen subjects and refuses to save none', async () => {
    const email = uniqueEmail('prefs');
    const { manage } = await subscribeAndConfirm(email);
    const none = await client(ctx.app).post(`/subscribe/manage/${manage}`).type('form').send('');
    expect(none.status).toBe(422);
    const saved = await client(ctx.app)
      .post(`/subscribe/manage/${manage}`)
      .type('form')
      .send(`categoryIds=${everyRoundup}`);
    expect(saved.status).toBe(200);
    expect(saved.text).toContain('Saved.');
  });
});

describe('header injection', () => {
  it('a CR/LF in a roundup title or a subject name never becomes a header of its own', async () => {
    const email = uniqueEmail('inject');
    await subscribeAndConfirm(email);
    const roundup = await createRoundup({ title: 'Boards\r\nBcc: victim@elsewhere.example\r\nX-Injected: yes' });
    await ctx.dataSource.query('UPDATE mail_categories SET name = ? WHERE id = ?', [
      'Every new roundup\r\nX-Category-Injected: yes',
      everyRoundup,
    ]);
    try {
      await ctx.dataSource.transaction((manager) => enqueueGoLiveMailing(manager, roundup.id));
      await sendAll(ctx.services.mailSender);
    } finally {
      await ctx.dataSource.query("UPDATE mail_categories SET name = 'Every new roundup' WHERE id = ?", [everyRoundup]);
    }
    const mail = (await messagesTo(email)).find((m) => m.subject?.startsWith('New roundup: Boards'))!;
    expect(mail).toBeDefined();
    expect(mail.headers.has('bcc')).toBe(false);
    expect(mail.headers.has('x-injected')).toBe(false);
    expect(mail.headers.has('x-category-injected')).toBe(false);
    expect(mail.subject).toBe('New roundup: Boards Bcc: victim@elsewhere.example X-Injected: yes');
    expect(await messagesTo('victim@elsewhere.example')).toHaveLength(0);
  });
});

describe('editors and the relay', () => {
  it('an editor sends a test to themselves and sees the mailing’s counts; an update is mailed only when chosen', async () => {
    const { agent, user } = await signedIn(ctx.app, 'editor');
    const subscriber = uniqueEmail('counts');
    await subscribeAndConfirm(subscriber);
    const roundup = await createRoundup();
    expect((await agent.post(`/api/roundups/${roundup.id}/mailings/test`)).status).toBe(202);
    await sendAll(ctx.services.mailSender);
    const test = await messagesTo(user.email);
    expect(test.at(-1)!.subject).toBe(`Test — new roundup: ${roundup.title}`);

    await ctx.dataSource.transaction((manager) => enqueueGoLiveMailing(manager, roundup.id));
    // Going live twice (a retried publish) queues nothing more.
    await ctx.dataSource.transaction((manager) => enqueueGoLiveMailing(manager, roundup.id));
    const before = await agent.get(`/api/roundups/${roundup.id}/mailings`);
    expect(before.body.mailings).toHaveLength(1);
    expect(before.body.mailings[0].counts.queued).toBe(before.body.mailings[0].counts.total);
    await sendAll(ctx.services.mailSender);
    const after = await agent.get(`/api/roundups/${roundup.id}/mailings`);
    expect(after.body.mailings[0].counts.sent).toBe(after.body.mailings[0].counts.total);
    expect(after.body.mailings[0].counts.queued).toBe(0);

    const update = await agent
      .post(`/api/roundups/${roundup.id}/mailings`)
      .send({ kind: 'correction', note: 'The second board’s peak was 81.0 °C, not 18.0 °C.' });
    expect(update.status).toBe(201);
    await sendAll(ctx.services.mailSender);
    const correction = (await messagesTo(subscriber)).at(-1)!;
    expect(correction.subject).toBe(`Correction: ${roundup.title}`);
    expect(correction.text).toContain('81.0 °C, not 18.0 °C');
  });

  it('a permanent refusal (5xx) fails the row and suppresses the address; the webhook needs its secret', async () => {
    const email = `reader-${Date.now()}@bounce.invalid`;
    await subscribeAndConfirm(email).catch(() => null);
    // The relay refuses bounce.invalid, so the confirmation itself failed and suppressed the address.
    const rows: { state: string }[] = await ctx.dataSource.query(
      'SELECT o.state FROM mail_outbox o JOIN subscribers s ON s.id = o.subscriber_id WHERE s.email = ?',
      [email],
    );
    expect(rows.map((r) => r.state)).toEqual(['failed']);
    const hash = await ctx.services.linkSecret.addressHash(email);
    expect(await ctx.dataSource.getRepository(MailSuppressionEntity).findOneBy({ addressHash: hash })).toMatchObject({
      reason: 'bounced',
    });

    await withMailTestContext({ MAIL_WEBHOOK_SECRET: 'a-shared-secret-of-enough-length' }, async (withSecret) => {
      const events = { events: [{ type: 'complaint', email: uniqueEmail('complains') }] };
      expect((await client(withSecret.app).post('/api/mail/events').send(events)).status).toBe(401);
      const ok = await client(withSecret.app)
        .post('/api/mail/events')
        .set('X-Benchwire-Webhook-Secret', 'a-shared-secret-of-enough-length')
        .send(events);
      expect(ok.status).toBe(200);
      expect(ok.body).toEqual({ received: 1, suppressed: 1 });
    });
  });
});

describe('go-live mail content', () => {
  it('carries the summary, the top picks with their labels and the approved chart inline, in HTML and in text', async () => {
    const reader = uniqueEmail('content');
    await subscribeAndConfirm(reader);
    const editor = await signedIn(ctx.app, 'editor');
    const tester = await signedIn(ctx.app, 'tester');
    // Two boards under one load, each with a manual run of record (figures of our own, not measurements).
    const { roundupId, products } = await roundupWithResults(editor.agent, tester, [
      [[{ peakC: 71.0 }]],
      [[{ peakC: 76.5 }]],
    ]);
    // The second board gets the stronger label, so it leads the picks whatever its position in the plan.
    const labels = [
      [products[0].entryId, 'recommended', 'A stock build on a budget'],
      [products[1].entryId, 'bench-pick', 'Sustained all-core loads'],
    ] as const;
    for (const [entryId, label, bestFor] of labels) {
      const set = await editor.agent
        .put(`/api/roundups/${roundupId}/verdicts/${entryId}`)
        .send({ label, bestFor, price: { amountMinor: 18999, currency: 'EUR' } });
      expect(set.status, set.text).toBe(200);
    }
    await approveAllCharts(editor.agent, roundupId);
    const images = await ctx.services.charts.approvedChartImages(roundupId);
    expect(images.length).toBeGreaterThan(0);
    const storedPng = await ctx.services.files.get(images[0].storageKey);

    await ctx.dataSource.transaction((manager) => enqueueGoLiveMailing(manager, roundupId));
    await sendAll(ctx.services.mailSender);
    const roundup = await ctx.dataSource.getRepository(RoundupEntity).findOneByOrFail({ id: roundupId });
    // keepCidLinks: the HTML as sent (mailparser otherwise rewrites cid: references to data: URLs).
    const mails = (await messagesTo(reader, { keepCidLinks: true })).filter((m) => m.subject?.includes(roundup.title));
    expect(mails).toHaveLength(1);
    const [mail] = mails;

    // The chart travels as an inline part (RFC 2392 Content-ID) and the HTML points at it with alt text.
    const inline = mail.attachments.filter((a) => a.contentDisposition === 'inline' && a.contentType === 'image/png');
    expect(inline).toHaveLength(1);
    const cid = inline[0].cid!;
    // PNG signature bytes 89 50 4E 47 0D 0A 1A 0A (PNG specification, ISO/IEC 15948, §5.2).
    expect([...inline[0].content.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
    expect(inline[0].content.equals(storedPng!)).toBe(true);
    const html = mail.html as string;
    const image = new RegExp(`<img src="cid:${cid.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}" alt="([^"]+)"`).exec(html);
    expect(image, 'an <img> of the inline part with alt text').not.toBeNull();
    expect(image![1]).toContain(images[0].title);

    // Summary, picks with labels (strongest first) and the link, in both parts.
    const [first, second] = await ctx.dataSource.query(
      'SELECT p.id, p.maker, p.model FROM roundup_entries e JOIN products p ON p.id = e.product_id WHERE e.id IN (?) ORDER BY FIELD(e.id, ?, ?)',
      [[products[1].entryId, products[0].entryId], products[1].entryId, products[0].entryId],
    );
    const text = mail.text ?? '';
    expect(text).toContain(`2 ${roundup.platform} boards tested for power-delivery temperatures under 1 load`);
    expect(html).toContain(`2 ${roundup.platform} boards tested for power-delivery temperatures under 1 load`);
    const pickLines = text.split('\n').filter((line) => line.startsWith('- '));
    expect(pickLines).toHaveLength(2);
    expect(pickLines[0]).toContain(first.model);
    expect(pickLines[0]).toMatch(/— Bench pick$/);
    expect(pickLines[1]).toContain(second.model);
    expect(pickLines[1]).toMatch(/— Recommended$/);
    expect(html).toMatch(/Bench pick<\/strong>[\s\S]*Recommended<\/strong>/);
    expect(text).toContain(image![1]);
    expect(text).toContain(`${site}/read/roundups/${roundupId}-`);
    // The unsubscribe headers stay.
    expect(rawHeader(mail, 'list-unsubscribe')).toMatch(/^<https:\/\/results\.soaksheet\.example\/unsubscribe\//);
    expect(rawHeader(mail, 'list-unsubscribe-post')).toBe('List-Unsubscribe=One-Click');
  });
});
