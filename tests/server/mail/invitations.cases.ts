import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { UserEntity } from '../../../server/entities/user.entity';
import { AuditEntryEntity } from '../../../server/entities/audit-entry.entity';
import { randomBytes } from 'node:crypto';
import { client, signedIn, testApp, uniqueEmail, type Client } from '../support/test-app';
import {
  closeMailTestContext,
  linkIn,
  mailTestContext,
  messagesTo,
  rawHeader,
  sendAll,
  type MailTestContext,
} from './mail-support';

let ctx: MailTestContext;
let admin: Client;
const site = 'https://results.soaksheet.example';

beforeAll(async () => {
  ctx = await mailTestContext();
  admin = (await signedIn(ctx.app, 'admin')).agent;
});
afterAll(async () => {
  await closeMailTestContext(ctx);
});

const password = 'soak-the-board-for-an-hour';

async function invite(overrides: Record<string, unknown> = {}) {
  const email = uniqueEmail('invited');
  const created = await admin
    .post('/api/users')
    .send({ email, displayName: 'Nell Invited', role: 'tester', ...overrides });
  expect(created.status, created.text).toBe(201);
  return { email, user: created.body };
}

/** The token of the newest invitation link mailed to an address. */
async function mailedToken(email: string): Promise<string> {
  await sendAll(ctx.services.mailSender);
  const mails = await messagesTo(email);
  expect(mails.length).toBeGreaterThan(0);
  return linkIn(mails[mails.length - 1].text, `${site}/welcome/`)
    .split('/')
    .pop() as string;
}

function accept(token: string, agent = client(ctx.app), body: Record<string, unknown> = {}) {
  return agent
    .post(`/api/invitations/${token}/accept`)
    .send({ newPassword: password, confirmPassword: password, ...body });
}

describe('staff invitations', () => {
  it('an admin invites; the mail carries a link; accepting sets the password, signs in, and the link is used up', async () => {
    const { email, user } = await invite();
    expect(user.passwordSet).toBe(false);
    expect(user.active).toBe(true);
    // 72 hours: the invitation lifetime this product chose (INVITATION_HOURS).
    expect(Date.parse(user.invitation.expiresAt) - Date.parse(user.invitation.sentAt)).toBe(72 * 3_600_000);

    // Before accepting, the account cannot sign in with any password.
    const early = await client(ctx.app).post('/api/auth/sign-in').send({ email, password });
    expect(early.status).toBe(401);

    const token = await mailedToken(email);
    const [mail] = await messagesTo(email);
    expect(mail.subject).toMatch(/invited you to Benchwire at The Soak Sheet/);
    expect(mail.text).toContain('Bench tester');
    expect(mail.html).toContain(`href="${site}/welcome/${token}"`);
    // Only the SHA-256 of the token is stored, and the sent mail's text leaves the outbox.
    const row = await ctx.dataSource.getRepository(UserEntity).findOneByOrFail({ id: user.id });
    expect(row.inviteTokenHash).toMatch(/^[0-9a-f]{64}$/);
    expect(row.inviteTokenHash).not.toContain(token);
    const [outbox] = await ctx.dataSource.query(
      "SELECT state, payload FROM mail_outbox WHERE user_id = ? AND kind = 'staff-invite'",
      [user.id],
    );
    expect(outbox.state).toBe('sent');
    expect(outbox.payload).toBeNull();

    const shown = await client(ctx.app).get(`/api/invitations/${token}`);
    expect(shown.status).toBe(200);
    expect(shown.body).toMatchObject({ email, displayName: 'Nell Invited', role: 'tester' });

    const browser = client(ctx.app);
    const accepted = await accept(token, browser);
    expect(accepted.status, accepted.text).toBe(200);
    expect(accepted.body.user).toMatchObject({ email, role: 'tester' });
    expect(String(accepted.headers['set-cookie'])).toContain('benchwire_session=');
    const session = await browser.get('/api/auth/session');
    expect(session.status).toBe(200);
    expect(session.body.user.email).toBe(email);

    const signIn = await client(ctx.app).post('/api/auth/sign-in').send({ email, password });
    expect(signIn.status).toBe(200);

    // Single use.
    const again = await accept(token);
    expect(again.status).toBe(410);
    expect(again.body.error.code).toBe('invitation_used');
    expect((await client(ctx.app).get(`/api/invitations/${token}`)).body.error.code).toBe('invitation_used');

    const audit = await ctx.dataSource
      .getRepository(AuditEntryEntity)
      .findBy({ subjectType: 'user', subjectId: String(user.id) });
    expect(audit.map((a) => a.action)).toEqual(
      expect.arrayContaining(['user.created', 'user.invitation_accepted', 'session.signed_in']),
    );
    const listed = (await admin.get('/api/users')).body.users.find((u: { id: number }) => u.id === user.id);
    expect(listed).toMatchObject({ passwordSet: true, invitation: null });
  });

  it('an expired link is refused with a clear message and sets nothing', async () => {
    const { email, user } = await invite();
    const token = await mailedToken(email);
    await ctx.dataSource.query('UPDATE users SET invite_expires_at = NOW(3) - INTERVAL 1 MINUTE WHERE id = ?', [
      user.id,
    ]);
    const shown = await client(ctx.app).get(`/api/invitations/${token}`);
    expect(shown.status).toBe(410);
    expect(shown.body.error).toMatchObject({ code: 'invitation_expired' });
    expect(shown.body.error.message).toContain('Ask an admin');
    const refused = await accept(token);
    expect(refused.status).toBe(410);
    expect((await ctx.dataSource.getRepository(UserEntity).findOneByOrFail({ id: user.id })).passwordHash).toBeNull();
    const listed = (await admin.get('/api/users')).body.users.find((u: { id: number }) => u.id === user.id);
    expect(listed.invitation.expired).toBe(true);
  });

  it('sending again voids the earlier link; an unknown link answers 404, never 500', async () => {
    const { email, user } = await invite();
    const first = await mailedToken(email);
    const resent = await admin.post(`/api/users/${user.id}/invitation`);
    expect(resent.status, resent.text).toBe(200);
    expect(resent.body.invitation.expired).toBe(false);
    const second = await mailedToken(email);
    expect(second).not.toBe(first);
    expect(await messagesTo(email)).toHaveLength(2);

    const old = await accept(first);
    expect(old.status).toBe(404);
    expect(old.body.error.code).toBe('invitation_unknown');
    expect((await client(ctx.app).get('/api/invitations/AAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAA')).status).toBe(
      404,
    );
    expect((await client(ctx.app).get('/api/invitations/not-a-token')).status).toBe(404);
    expect((await accept(second)).status).toBe(200);

    // Nothing to send again once the password is set.
    const needless = await admin.post(`/api/users/${user.id}/invitation`);
    expect(needless.status).toBe(409);
  });

  it('deactivating an invited account voids its link', async () => {
    const { email, user } = await invite();
    const token = await mailedToken(email);
    const withdrawn = await admin.patch(`/api/users/${user.id}`).send({ active: false });
    expect(withdrawn.status).toBe(200);
    expect(withdrawn.body.invitation).toBeNull();
    expect((await accept(token)).status).toBe(404);
    const resend = await admin.post(`/api/users/${user.id}/invitation`);
    expect(resend.status).toBe(409);
    expect(resend.body.error.code).toBe('account_deactivated');
  });

  it('only account managers invite or send again; accepting takes nothing but the two passwords', async () => {
    const editor = (await signedIn(ctx.app, 'editor')).agent;
    const refused = await editor
      .post('/api/users')
      .send({ email: uniqueEmail('nope'), displayName: 'Not Allowed', role: 'admin' });
    expect(refused.status).toBe(403);

    const { email, user } = await invite();
    expect((await editor.post(`/api/users/${user.id}/invitation`)).status).toBe(403);
    const token = await mailedToken(email);
    const sneaky = await accept(token, client(ctx.app), { role: 'admin', active: true });
    expect(sneaky.status).toBe(400);
    const untouched = await ctx.dataSource.getRepository(UserEntity).findOneByOrFail({ id: user.id });
    expect(untouched.role).toBe('tester');
    expect(untouched.passwordHash).toBeNull();

    const mismatch = await accept(token, client(ctx.app), { confirmPassword: 'something-else-entirely' });
    expect(mismatch.status).toBe(400);
    expect(mismatch.body.error.fields.confirmPassword).toBeTruthy();

    // A foreign Origin is refused like every other state-changing request.
    const foreign = await client(ctx.app)
      .post(`/api/invitations/${token}/accept`)
      .set('Origin', 'https://elsewhere.example')
      .send({ newPassword: password, confirmPassword: password });
    expect(foreign.status).toBe(403);
    expect((await accept(token)).status).toBe(200);
  });

  it('a name with CR/LF and markup stays inert in the subject and the HTML part', async () => {
    const inviter = await signedIn(ctx.app, 'admin');
    await ctx.dataSource
      .getRepository(UserEntity)
      .update({ id: inviter.user.id }, { displayName: 'Ada\r\nBcc: victim@elsewhere.example <b>x</b>' });
    const email = uniqueEmail('hostile');
    const created = await inviter.agent
      .post('/api/users')
      .send({ email, displayName: '<img src=x onerror=alert(1)> Probe', role: 'writer' });
    expect(created.status).toBe(201);
    await sendAll(ctx.services.mailSender);
    const [mail] = await messagesTo(email);
    expect(rawHeader(mail, 'Subject')).not.toMatch(/[\r\n]/);
    expect(mail.headerLines.find((h) => h.key === 'bcc')).toBeUndefined();
    expect(mail.html).not.toContain('<img src=x');
    expect(mail.html).toContain('&lt;img src=x onerror=alert(1)&gt; Probe');
    expect(mail.html).toContain('&lt;b&gt;x&lt;/b&gt;');
  });

  it('guessing links is throttled per client address like sign-in: 429 with Retry-After', async () => {
    const app = await testApp({ TRUST_PROXY: 'true', SIGN_IN_LIMIT_PER_IP: '3', SIGN_IN_WINDOW_MINUTES: '15' });
    // An address of this test's own (the documentation prefix, RFC 3849; IPv6 counts per /56), so no other test's
    // counters are touched.
    const hex = randomBytes(3).toString('hex');
    const from = `2001:db8:${hex.slice(0, 4)}:${hex.slice(4)}00::1`;
    const guess = () =>
      client(app)
        .set('X-Forwarded-For', from)
        .get(`/api/invitations/${randomBytes(32).toString('base64url')}`);
    const statuses: number[] = [];
    for (let i = 0; i < 5; i++) statuses.push((await guess()).status);
    expect(statuses.slice(0, 3)).toEqual([404, 404, 404]);
    expect(statuses.slice(3)).toEqual([429, 429]);
    const refused = await guess();
    expect(refused.headers['retry-after']).toMatch(/^\d+$/);
    expect(refused.body.error.message).toContain('invitation links');
  });
});
