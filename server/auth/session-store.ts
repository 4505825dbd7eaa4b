// Sessions for Benchwire. lucia v3 is in maintenance, so it stays behind this module: the rest of the
// server only calls the functions exported here, and swapping the library touches this file alone.
import { createHash } from 'node:crypto';
import { Lucia, TimeSpan } from 'lucia';
import type { Adapter, DatabaseSession, DatabaseUser } from 'lucia';
import { LessThan, type DataSource } from 'typeorm';
import { SessionEntity } from '../entities/session.entity';
import type { Role } from '../../shared/schemas/common';

type SessionAttributes = { userAgent: string | null; ipAddress: string | null; createdAt: Date };
type UserAttributes = { email: string; displayName: string; role: Role; active: boolean };

class TypeormSessionAdapter implements Adapter {
  constructor(private readonly dataSource: DataSource) {}

  private get sessions() {
    return this.dataSource.getRepository(SessionEntity);
  }

  private toDatabaseSession(row: SessionEntity): DatabaseSession {
    return {
      id: row.id,
      userId: row.userId,
      expiresAt: row.expiresAt,
      attributes: { userAgent: row.userAgent, ipAddress: row.ipAddress, createdAt: row.createdAt },
    };
  }

  async getSessionAndUser(sessionId: string): Promise<[DatabaseSession | null, DatabaseUser | null]> {
    // Every API request asks this: one joined query (findOne with a relation costs TypeORM two round trips).
    const row = await this.sessions
      .createQueryBuilder('session')
      .innerJoinAndSelect('session.user', 'user')
      .where('session.id = :sessionId', { sessionId })
      .getOne();
    if (!row || !row.user || !row.user.active) return [null, null];
    const { user } = row;
    return [
      this.toDatabaseSession(row),
      {
        id: user.id,
        attributes: { email: user.email, displayName: user.displayName, role: user.role, active: user.active },
      },
    ];
  }

  async getUserSessions(userId: number): Promise<DatabaseSession[]> {
    const rows = await this.sessions.find({ where: { userId }, order: { createdAt: 'DESC' } });
    return rows.map((row) => this.toDatabaseSession(row));
  }

  async setSession(session: DatabaseSession): Promise<void> {
    const attributes = session.attributes as Partial<SessionAttributes>;
    await this.sessions.insert({
      id: session.id,
      userId: session.userId as number,
      expiresAt: session.expiresAt,
      userAgent: attributes.userAgent?.slice(0, 255) ?? null,
      ipAddress: attributes.ipAddress ?? null,
    });
  }

  async updateSessionExpiration(sessionId: string, expiresAt: Date): Promise<void> {
    await this.sessions.update({ id: sessionId }, { expiresAt });
  }

  async deleteSession(sessionId: string): Promise<void> {
    await this.sessions.delete({ id: sessionId });
  }

  async deleteUserSessions(userId: number): Promise<void> {
    await this.sessions.delete({ userId });
  }

  async deleteExpiredSessions(): Promise<void> {
    await this.sessions.delete({ expiresAt: LessThan(new Date()) });
  }
}

export const SESSION_COOKIE = 'benchwire_session';

/**
 * On HTTPS the cookie carries the `__Host-` prefix: browsers then accept it only with Secure, Path=/ and no Domain,
 * so neither a sibling subdomain nor a plain-HTTP page can plant or overwrite it (RFC 6265bis §4.1.3.2).
 */
export function sessionCookieName(secureCookie: boolean): string {
  return secureCookie ? `__Host-${SESSION_COOKIE}` : SESSION_COOKIE;
}

/**
 * The name a session is listed and revoked by. The session id is the cookie's secret value, so it never leaves
 * the server except in Set-Cookie; this one-way hash of it (132 bits, URL-safe) tells sessions apart instead.
 */
export function publicSessionId(sessionId: string): string {
  return createHash('sha256').update(sessionId).digest('base64url').slice(0, 22);
}
export const PUBLIC_SESSION_ID_PATTERN = /^[A-Za-z0-9_-]{22}$/;

export function createSessionStore(dataSource: DataSource, options: { secureCookie: boolean; sessionDays: number }) {
  return new Lucia(new TypeormSessionAdapter(dataSource), {
    sessionExpiresIn: new TimeSpan(options.sessionDays, 'd'),
    sessionCookie: {
      name: sessionCookieName(options.secureCookie),
      expires: true,
      attributes: { secure: options.secureCookie, sameSite: 'lax' },
    },
    getSessionAttributes: (attributes) => attributes,
    getUserAttributes: (attributes) => attributes,
  });
}

export type SessionStore = ReturnType<typeof createSessionStore>;
export { verifyRequestOrigin } from 'lucia';

declare module 'lucia' {
  interface Register {
    Lucia: SessionStore;
    UserId: number;
    DatabaseUserAttributes: UserAttributes;
    DatabaseSessionAttributes: SessionAttributes;
  }
}
