import type { DataSource } from 'typeorm';
import { Not } from 'typeorm';
import { UserEntity } from '../entities/user.entity';
import { SessionEntity } from '../entities/session.entity';
import { hashPassword, verifyPassword } from '../auth/passwords';
import type { PasswordAttempt } from '../auth/password-guesses';
import { publicSessionId, type SessionStore } from '../auth/session-store';
import { AppError } from '../errors';
import { recordAction } from './audit.service';
import type { ChangePasswordRequest, CurrentUser, SessionInfo, SignInRequest } from '../../shared/schemas/auth';

const wrongCredentials = () =>
  new AppError('invalid_credentials', 401, 'That e-mail and password do not match an active account.');

export class AuthService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly sessions: SessionStore,
  ) {}

  /**
   * Checks the password and opens a new session. Unknown, wrong and deactivated all answer the same. The
   * session the browser presented, if any, ends: signing in always yields a fresh id.
   */
  async signIn(
    input: SignInRequest,
    client: { userAgent: string | null; ipAddress: string | null },
    attempt: PasswordAttempt,
    presentedSessionId: string | null,
  ) {
    const user = await this.dataSource.getRepository(UserEntity).findOneBy({ email: input.email });
    const ok = await verifyPassword(user?.passwordHash ?? null, input.password);
    await attempt.settle(Boolean(user && ok && user.active));
    if (!user || !ok || !user.active) throw wrongCredentials();
    return this.openSession(user, client, presentedSessionId);
  }

  /**
   * A new session for a user whose identity was just proven (a right password, an accepted invitation). The
   * session the browser presented, if any, ends first, so the id always changes.
   */
  async openSession(
    user: UserEntity,
    client: { userAgent: string | null; ipAddress: string | null },
    presentedSessionId: string | null,
  ) {
    if (presentedSessionId) await this.sessions.invalidateSession(presentedSessionId);
    const session = await this.sessions.createSession(user.id, { ...client, createdAt: new Date() });
    await this.dataSource.transaction(async (manager) => {
      await manager.getRepository(UserEntity).update({ id: user.id }, { lastSignInAt: new Date() });
      await recordAction(manager, user, 'session.signed_in', ['user', user.id], { ip: client.ipAddress });
    });
    const current: CurrentUser = { id: user.id, email: user.email, displayName: user.displayName, role: user.role };
    return { session, user: current };
  }

  signOut(sessionId: string) {
    return this.sessions.invalidateSession(sessionId);
  }

  async listSessions(userId: number, currentSessionId: string): Promise<SessionInfo[]> {
    const rows = await this.dataSource
      .getRepository(SessionEntity)
      .find({ where: { userId }, order: { createdAt: 'DESC' } });
    return rows
      .filter((row) => row.expiresAt.getTime() > Date.now())
      .map((row) => ({
        id: publicSessionId(row.id),
        current: row.id === currentSessionId,
        createdAt: row.createdAt.toISOString(),
        expiresAt: row.expiresAt.toISOString(),
        userAgent: row.userAgent,
        ipAddress: row.ipAddress,
      }));
  }

  /** Ends one of the user's sessions, named by its public id. */
  async revokeSession(userId: number, publicId: string) {
    const repository = this.dataSource.getRepository(SessionEntity);
    const mine = await repository.find({ select: { id: true }, where: { userId } });
    const target = mine.find((row) => publicSessionId(row.id) === publicId);
    const result = target ? await repository.delete({ id: target.id, userId }) : null;
    if (!result?.affected) throw new AppError('not_found', 404, 'That session was not found among yours.');
  }

  /** Changes the password and ends every other session of the user, in one transaction. */
  async changePassword(
    userId: number,
    currentSessionId: string,
    input: ChangePasswordRequest,
    attempt: PasswordAttempt,
  ) {
    const user = await this.dataSource.getRepository(UserEntity).findOneByOrFail({ id: userId });
    const ok = await verifyPassword(user.passwordHash, input.currentPassword);
    await attempt.settle(ok);
    if (!ok) {
      throw new AppError('wrong_password', 400, 'Your current password is not right.', {
        currentPassword: 'This is not your current password.',
      });
    }
    const passwordHash = await hashPassword(input.newPassword);
    await this.dataSource.transaction(async (manager) => {
      await manager.getRepository(UserEntity).update({ id: userId }, { passwordHash });
      await manager.getRepository(SessionEntity).delete({ userId, id: Not(currentSessionId) });
      await recordAction(manager, { id: userId }, 'user.password_changed', ['user', userId]);
    });
  }
}
