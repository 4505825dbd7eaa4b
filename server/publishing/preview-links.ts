import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import type { DataSource } from 'typeorm';

// A preview link names a roundup and an expiry, signed with HMAC-SHA-256 under a server secret: anyone holding
// the link may read the unpublished page until the expiry, without an account; changing a byte breaks the signature.

export interface PreviewClaims {
  roundupId: number;
  /** Expiry, whole seconds since 1970 (UTC). */
  expiresAt: number;
}

export type PreviewCheck =
  { ok: true; claims: PreviewClaims } | { ok: false; reason: 'malformed' | 'bad-signature' | 'expired' };

function sign(secret: Buffer, payload: string): Buffer {
  return createHmac('sha256', secret).update(`benchwire-preview.${payload}`).digest();
}

export function createPreviewToken(secret: Buffer, claims: PreviewClaims): string {
  const payload = Buffer.from(JSON.stringify({ r: claims.roundupId, e: claims.expiresAt })).toString('base64url');
  return `${payload}.${sign(secret, payload).toString('base64url')}`;
}

export function verifyPreviewToken(secret: Buffer, token: string, now: Date): PreviewCheck {
  const match = /^([A-Za-z0-9_-]{1,200})\.([A-Za-z0-9_-]{43})$/.exec(token);
  if (!match) return { ok: false, reason: 'malformed' };
  const [, payload, signature] = match;
  // Compared as text: the last of 43 base64url characters carries two unused bits, so decoding first would accept
  // four spellings of one signature.
  const expected = Buffer.from(sign(secret, payload).toString('base64url'));
  const given = Buffer.from(signature);
  if (given.length !== expected.length || !timingSafeEqual(given, expected))
    return { ok: false, reason: 'bad-signature' };
  let claims: { r?: unknown; e?: unknown };
  try {
    claims = JSON.parse(Buffer.from(payload, 'base64url').toString('utf8')) as { r?: unknown; e?: unknown };
  } catch {
    return { ok: false, reason: 'malformed' };
  }
  if (!Number.isSafeInteger(claims.r) || !Number.isSafeInteger(claims.e)) return { ok: false, reason: 'malformed' };
  const expiresAt = claims.e as number;
  if (now.getTime() >= expiresAt * 1000) return { ok: false, reason: 'expired' };
  return { ok: true, claims: { roundupId: claims.r as number, expiresAt } };
}

/**
 * The preview-link key: PREVIEW_LINK_SECRET when set, otherwise a random key made once and kept in the database, so
 * every server process (and every restart) signs and checks with the same one.
 */
export async function loadPreviewSecret(dataSource: DataSource, configured: string | undefined): Promise<Buffer> {
  if (configured) return Buffer.from(configured, 'utf8');
  await dataSource.query(`INSERT IGNORE INTO server_secrets (name, secret) VALUES ('preview-links', ?)`, [
    randomBytes(32),
  ]);
  const [row] = (await dataSource.query(`SELECT secret FROM server_secrets WHERE name = 'preview-links'`)) as {
    secret: Buffer;
  }[];
  return Buffer.from(row.secret);
}
