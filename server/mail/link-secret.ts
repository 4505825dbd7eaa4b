import { createHash, createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import type { DataSource } from 'typeorm';
import { AppSecretEntity } from '../entities/mail.entities';

/**
 * The key of subscribers' signed links and of the salted address hashes on the suppression list: MAIL_LINK_SECRET,
 * or one made at first use and kept in the database so every server process and the sender share it.
 */
export class LinkSecret {
  private secret: Promise<Buffer> | null = null;

  constructor(
    private readonly dataSource: DataSource,
    private readonly configured?: string,
  ) {}

  private load(): Promise<Buffer> {
    this.secret ??= (async () => {
      if (this.configured) return Buffer.from(this.configured, 'utf8');
      const repo = this.dataSource.getRepository(AppSecretEntity);
      await repo
        .createQueryBuilder()
        .insert()
        .orIgnore()
        .values({ name: 'mail-links', value: randomBytes(48).toString('base64url'), createdAt: new Date() })
        .execute();
      const row = await repo.findOneByOrFail({ name: 'mail-links' });
      return Buffer.from(row.value, 'utf8');
    })().catch((error) => {
      this.secret = null;
      throw error;
    });
    return this.secret;
  }

  async sign(purpose: string, value: string): Promise<string> {
    return createHmac('sha256', await this.load())
      .update(`${purpose}\0${value}`)
      .digest('base64url')
      .slice(0, 32);
  }

  async verify(purpose: string, value: string, signature: string): Promise<boolean> {
    const expected = Buffer.from(await this.sign(purpose, value));
    const given = Buffer.from(signature);
    return given.length === expected.length && timingSafeEqual(given, expected);
  }

  /** The suppression list's salted hash of an address (lower-cased, trimmed). */
  async addressHash(email: string): Promise<string> {
    return createHmac('sha256', await this.load())
      .update(`suppression\0${email.trim().toLowerCase()}`)
      .digest('hex');
  }
}

/** A subscriber's self-service token: `<id>.<version>.<signature>`, good until the link version is raised. */
export async function manageToken(secret: LinkSecret, subscriber: { id: number; linkVersion: number }) {
  const value = `${subscriber.id}.${subscriber.linkVersion}`;
  return `${value}.${await secret.sign('manage', value)}`;
}

/** The subscriber id and version a self-service token names, or null when it is malformed or forged. */
export async function readManageToken(
  secret: LinkSecret,
  token: string,
): Promise<{ subscriberId: number; linkVersion: number } | null> {
  const match = /^([1-9][0-9]{0,9})\.([1-9][0-9]{0,9})\.([A-Za-z0-9_-]{32})$/.exec(token);
  if (!match) return null;
  if (!(await secret.verify('manage', `${match[1]}.${match[2]}`, match[3]))) return null;
  return { subscriberId: Number(match[1]), linkVersion: Number(match[2]) };
}

/** A confirmation token (256 random bits) and the SHA-256 the database keeps. */
export function newConfirmToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashConfirmToken(token) };
}

export function hashConfirmToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}
