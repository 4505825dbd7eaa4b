import { beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { loadPreviewSecret, createPreviewToken, verifyPreviewToken } from '../../../server/publishing/preview-links';
import { signedIn, testApp, testDataSource, TEST_HOST, type TestApp } from '../support/test-app';
import { roundupInReview } from './support/publishing-fixtures';

const secret = Buffer.from('a test key that is only for this file, 32+ chars');
let dataSource: DataSource;
let app: TestApp;

beforeAll(async () => {
  dataSource = await testDataSource();
  app = await testApp();
});

describe('preview link tokens', () => {
  const now = new Date('2027-05-01T10:00:00Z');
  const expiresAt = Math.floor(now.getTime() / 1000) + 3600;

  it('a valid token names its roundup until its expiry, and not at or after it', () => {
    const token = createPreviewToken(secret, { roundupId: 42, expiresAt });
    expect(verifyPreviewToken(secret, token, now)).toEqual({ ok: true, claims: { roundupId: 42, expiresAt } });
    expect(verifyPreviewToken(secret, token, new Date(expiresAt * 1000 - 1))).toMatchObject({ ok: true });
    expect(verifyPreviewToken(secret, token, new Date(expiresAt * 1000))).toEqual({ ok: false, reason: 'expired' });
  });

  it('a tampered token is refused: another roundup, a later expiry, another key, a changed signature', () => {
    const token = createPreviewToken(secret, { roundupId: 42, expiresAt });
    const [, signature] = token.split('.');
    const otherRoundup = `${Buffer.from(JSON.stringify({ r: 43, e: expiresAt })).toString('base64url')}.${signature}`;
    const longer = `${Buffer.from(JSON.stringify({ r: 42, e: expiresAt + 86_400 })).toString('base64url')}.${signature}`;
    expect(verifyPreviewToken(secret, otherRoundup, now)).toEqual({ ok: false, reason: 'bad-signature' });
    expect(verifyPreviewToken(secret, longer, now)).toEqual({ ok: false, reason: 'bad-signature' });
    expect(verifyPreviewToken(Buffer.from('another key entirely, also long enough'), token, now)).toEqual({
      ok: false,
      reason: 'bad-signature',
    });
    const flipped = token.slice(0, -2) + (token.endsWith('AA') ? 'AB' : 'AA');
    expect(verifyPreviewToken(secret, flipped, now).ok).toBe(false);
    // RFC 4648 §3.5: 32 bytes take 43 base64url characters and the last one's two low bits are padding; a token whose
    // last character differs only there decodes to the same bytes and must still be refused.
    const alphabet = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789-_';
    const last = alphabet.indexOf(token.slice(-1));
    const respelled = token.slice(0, -1) + alphabet[last ^ 1];
    expect(Buffer.from(respelled.split('.')[1], 'base64url')).toEqual(Buffer.from(signature, 'base64url'));
    expect(verifyPreviewToken(secret, respelled, now).ok).toBe(false);
    expect(verifyPreviewToken(secret, 'not-a-token', now)).toEqual({ ok: false, reason: 'malformed' });
  });
});

describe('preview links', () => {
  it('an editor shares a link that shows the unpublished page without an account', async () => {
    const { agent: editor } = await signedIn(app, 'editor');
    const { roundupId, title } = await roundupInReview(app, editor, dataSource);
    const created = await editor.post(`/api/roundups/${roundupId}/preview-links`).send({ hours: 48 });
    expect(created.status, created.text).toBe(201);
    expect(created.body.url).toBe(`http://${TEST_HOST}${created.body.path}`);
    const hours = (Date.parse(created.body.expiresAt) - Date.now()) / 3_600_000;
    expect(hours).toBeGreaterThan(47.9);
    expect(hours).toBeLessThanOrEqual(48);

    const page = await request(app).get(created.body.path).set('Host', TEST_HOST);
    expect(page.status).toBe(200);
    expect(page.text).toContain(title);
    expect(page.headers['cache-control']).toBe('no-store');
    expect(page.headers['x-robots-tag']).toMatch(/noindex/);

    const tampered = created.body.path.replace(/.$/, (c: string) => (c === 'A' ? 'B' : 'A'));
    expect((await request(app).get(tampered).set('Host', TEST_HOST)).status).toBe(404);
  });

  it('an expired link says so and shows nothing', async () => {
    const { agent: editor } = await signedIn(app, 'editor');
    const { roundupId, title } = await roundupInReview(app, editor, dataSource);
    const key = await loadPreviewSecret(dataSource, undefined);
    const token = createPreviewToken(key, { roundupId, expiresAt: Math.floor(Date.now() / 1000) - 1 });
    const page = await request(app).get(`/preview/${token}`).set('Host', TEST_HOST);
    expect(page.status).toBe(410);
    expect(page.text).not.toContain(title);
  });

  it('only editors create preview links; hours are bounded', async () => {
    const { agent: editor } = await signedIn(app, 'editor');
    const { roundupId } = await roundupInReview(app, editor, dataSource);
    expect((await editor.post(`/api/roundups/${roundupId}/preview-links`).send({ hours: 0 })).status).toBe(400);
    expect((await editor.post(`/api/roundups/${roundupId}/preview-links`).send({ hours: 721 })).status).toBe(400);
    const { agent: tester } = await signedIn(app, 'tester');
    expect((await tester.post(`/api/roundups/${roundupId}/preview-links`).send({ hours: 1 })).status).toBe(403);
  });
});
