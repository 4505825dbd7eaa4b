import { describe, expect, it } from 'vitest';
import { AuditEntryEntity } from '../../server/entities/audit-entry.entity';
import { SessionEntity } from '../../server/entities/session.entity';
import { client, createTestUser, signedIn, signIn, testApp, testDataSource, uniqueEmail } from './support/test-app';

describe('staff accounts (admin)', () => {
  it('when an admin creates a writer, then the writer can sign in and the creation is audited', async () => {
    const app = await testApp();
    const { agent: admin } = await signedIn(app, 'admin');
    const email = uniqueEmail('new-writer');
    const created = await admin
      .post('/api/users')
      .send({ email, displayName: 'Mira Falkenrath', role: 'writer', password: 'a-long-enough-pass' });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ email, role: 'writer', active: true });
    const signIn = await client(app).post('/api/auth/sign-in').send({ email, password: 'a-long-enough-pass' });
    expect(signIn.status).toBe(200);
    const audit = await (
      await testDataSource()
    )
      .getRepository(AuditEntryEntity)
      .findOneBy({ action: 'user.created', subjectId: String(created.body.id) });
    expect(audit?.details).toMatchObject({ email, role: 'writer' });
  });

  it('when the e-mail is already used, then 409 names the field', async () => {
    const app = await testApp();
    const { agent: admin, user } = await signedIn(app, 'admin');
    const response = await admin
      .post('/api/users')
      .send({ email: user.email, displayName: 'Twin', role: 'tester', password: 'a-long-enough-pass' });
    expect(response.status).toBe(409);
    expect(response.body.error.code).toBe('email_taken');
    expect(response.body.error.fields.email).toBeTruthy();
  });

  it('passwords shorter than 12 or longer than 128 characters are refused, 128 is kept whole', async () => {
    const app = await testApp();
    const { agent: admin } = await signedIn(app, 'admin');
    const short = await admin
      .post('/api/users')
      .send({ email: uniqueEmail(), displayName: 'Short', role: 'tester', password: 'eleven-char' });
    expect(short.status).toBe(400);
    expect(short.body.error.fields.password).toMatch(/12/);
    const tooLong = await admin
      .post('/api/users')
      .send({ email: uniqueEmail(), displayName: 'Long', role: 'tester', password: 'x'.repeat(129) });
    expect(tooLong.status).toBe(400);
    const email = uniqueEmail('long');
    const longest = 'y'.repeat(127) + 'z';
    expect(
      (await admin.post('/api/users').send({ email, displayName: 'Longest', role: 'tester', password: longest }))
        .status,
    ).toBe(201);
    // No truncation: the same password minus its last character must not work.
    expect(
      (
        await client(app)
          .post('/api/auth/sign-in')
          .send({ email, password: 'y'.repeat(127) })
      ).status,
    ).toBe(401);
    expect((await client(app).post('/api/auth/sign-in').send({ email, password: longest })).status).toBe(200);
  });

  it('when an admin deactivates a user, then that user is signed out everywhere at once', async () => {
    const app = await testApp();
    const { agent: admin } = await signedIn(app, 'admin');
    const { agent: tester, user } = await signedIn(app, 'tester');
    const { agent: testerPhone } = await signedIn(app, user);
    expect((await tester.get('/api/auth/session')).status).toBe(200);
    const response = await admin.patch(`/api/users/${user.id}`).send({ active: false });
    expect(response.status).toBe(200);
    expect(response.body.active).toBe(false);
    expect((await tester.get('/api/auth/session')).status).toBe(401);
    expect((await testerPhone.get('/api/auth/session')).status).toBe(401);
    // And reactivating lets them sign in again.
    await admin.patch(`/api/users/${user.id}`).send({ active: true });
    expect((await signIn(client(app), user)).response.status).toBe(200);
  });

  it('an admin cannot deactivate themselves or drop their own admin role', async () => {
    const app = await testApp();
    const { agent: admin, user } = await signedIn(app, 'admin');
    expect((await admin.patch(`/api/users/${user.id}`).send({ active: false })).status).toBe(409);
    expect((await admin.patch(`/api/users/${user.id}`).send({ role: 'writer' })).status).toBe(409);
  });

  it('editing an unknown user answers 404', async () => {
    const app = await testApp();
    const { agent: admin } = await signedIn(app, 'admin');
    expect((await admin.patch('/api/users/99999999').send({ displayName: 'Ghost' })).status).toBe(404);
  });
});

describe('own password and sessions', () => {
  it('when a user changes their password, then their other sessions end and this one stays', async () => {
    const app = await testApp();
    const { agent: laptop, user } = await signedIn(app, 'editor');
    const { agent: phone } = await signedIn(app, user);
    const response = await laptop.post('/api/account/password').send({
      currentPassword: user.password,
      newPassword: 'the-new-password-1',
      confirmPassword: 'the-new-password-1',
    });
    expect(response.status).toBe(200);
    expect((await laptop.get('/api/auth/session')).status).toBe(200);
    expect((await phone.get('/api/auth/session')).status).toBe(401);
    expect((await signIn(client(app), user)).response.status).toBe(401);
    expect(
      (await client(app).post('/api/auth/sign-in').send({ email: user.email, password: 'the-new-password-1' })).status,
    ).toBe(200);
  });

  it('a wrong current password or a mismatched confirmation is a field error', async () => {
    const app = await testApp();
    const { agent, user } = await signedIn(app, 'writer');
    const wrong = await agent
      .post('/api/account/password')
      .send({ currentPassword: 'nope', newPassword: 'the-new-password-1', confirmPassword: 'the-new-password-1' });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields.currentPassword).toBeTruthy();
    const mismatch = await agent.post('/api/account/password').send({
      currentPassword: user.password,
      newPassword: 'the-new-password-1',
      confirmPassword: 'the-new-password-2',
    });
    expect(mismatch.status).toBe(400);
    expect(mismatch.body.error.fields.confirmPassword).toBeTruthy();
  });

  it('a user sees their sessions, with this one marked, and can revoke another', async () => {
    const app = await testApp();
    const { agent: laptop, user } = await signedIn(app, 'tester');
    const { agent: phone } = await signedIn(app, user);
    const list = await laptop.get('/api/account/sessions');
    expect(list.status).toBe(200);
    expect(list.body.sessions).toHaveLength(2);
    const other = list.body.sessions.find((s: { current: boolean }) => !s.current);
    expect(list.body.sessions.filter((s: { current: boolean }) => s.current)).toHaveLength(1);
    expect((await laptop.delete(`/api/account/sessions/${other.id}`)).status).toBe(200);
    expect((await phone.get('/api/auth/session')).status).toBe(401);
    expect((await laptop.get('/api/auth/session')).status).toBe(200);
  });

  it('the session list never shows a cookie value, and a cookie value does not revoke anything', async () => {
    const app = await testApp();
    const user = await createTestUser('editor');
    const laptop = client(app);
    const { sessionCookie: token } = await signIn(laptop, user);
    expect(token).toBeDefined();
    const { agent: phone } = await signedIn(app, user);
    const list = await laptop.get('/api/account/sessions');
    expect(list.text).not.toContain(token);
    const storedIds = (await (await testDataSource()).getRepository(SessionEntity).findBy({ userId: user.id })).map(
      (row) => row.id,
    );
    expect(storedIds).toHaveLength(2);
    for (const id of storedIds) expect(list.text).not.toContain(id);
    for (const session of list.body.sessions) expect(session.id).toMatch(/^[A-Za-z0-9_-]{22}$/);
    // The phone's own cookie value is not a name the revoke route accepts.
    const phoneToken = storedIds.find((id) => id !== token)!;
    const byToken = await laptop.delete(`/api/account/sessions/${phoneToken}`);
    expect(byToken.status).toBe(400);
    expect((await phone.get('/api/auth/session')).status).toBe(200);
  });

  it("a user cannot revoke someone else's session", async () => {
    const app = await testApp();
    const { agent: mine } = await signedIn(app, 'tester');
    const { agent: theirs } = await signedIn(app, 'tester');
    const theirSession = (await theirs.get('/api/account/sessions')).body.sessions[0];
    expect((await mine.delete(`/api/account/sessions/${theirSession.id}`)).status).toBe(404);
    expect((await theirs.get('/api/auth/session')).status).toBe(200);
  });
});
