import { createHash, randomBytes } from 'node:crypto';
import type { DataSource, EntityManager } from 'typeorm';
import { UserEntity } from '../entities/user.entity';
import { SessionEntity } from '../entities/session.entity';
import { hashPassword } from '../auth/passwords';
import type { PasswordAttempt } from '../auth/password-guesses';
import { AppError, conflict, notFound } from '../errors';
import { enqueueMail } from '../mail/outbox';
import { invitationMail } from '../mail/staff-invitation';
import { recordAction } from './audit.service';
import { INVITATION_HOURS, type AcceptInvitationRequest, type Invitation } from '../../shared/schemas/users';
import type { CurrentUser } from '../../shared/schemas/auth';

export interface InvitationSettings {
  /** The public base URL the link in the mail starts with. */
  siteUrl: string;
  outletName: string;
  hours?: number;
}

/** SHA-256 (hex) of an invitation token: the only form of it the database keeps. */
export function hashInvitationToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

const askForNew = 'Ask an admin at your outlet to send you a new invitation.';
const unknownLink = () =>
  new AppError(
    'invitation_unknown',
    404,
    `This invitation link is not valid: it may have been replaced by a newer one or withdrawn. ${askForNew}`,
  );
const usedLink = () =>
  new AppError(
    'invitation_used',
    410,
    'This invitation has already been used to set a password. Sign in with that password, or ask an admin to reset it.',
  );
const expiredLink = () => new AppError('invitation_expired', 410, `This invitation link has expired. ${askForNew}`);

/**
 * Staff invitations: a single-use link (32 random bytes; only its SHA-256 is stored) mailed through the outbox in
 * the same transaction as the account or the resend, and accepted once to set the first password.
 */
export class InvitationsService {
  private readonly hours: number;

  constructor(
    private readonly dataSource: DataSource,
    private readonly settings: InvitationSettings,
  ) {
    this.hours = settings.hours ?? INVITATION_HOURS;
  }

  /**
   * Makes a new token for an account without a password (the earlier one stops working), and queues the mail, in the
   * caller's transaction. Queued mails of earlier invitations to the account that have not left yet are dropped.
   */
  async issue(manager: EntityManager, user: UserEntity, actor: CurrentUser, now = new Date()): Promise<void> {
    const token = randomBytes(32).toString('base64url');
    const tokenHash = hashInvitationToken(token);
    const expiresAt = new Date(now.getTime() + this.hours * 3_600_000);
    await manager
      .getRepository(UserEntity)
      .update(
        { id: user.id },
        { inviteTokenHash: tokenHash, inviteExpiresAt: expiresAt, inviteSentAt: now, inviteAcceptedAt: null },
      );
    await manager.query(
      `UPDATE mail_outbox SET state = 'suppressed', payload = NULL
        WHERE user_id = ? AND kind = 'staff-invite' AND state IN ('queued', 'deferred')`,
      [user.id],
    );
    await enqueueMail(manager, {
      key: `staff-invite:user:${user.id}:${tokenHash.slice(0, 16)}`,
      kind: 'staff-invite',
      userId: user.id,
      payload: invitationMail({
        outletName: this.settings.outletName,
        inviteeName: user.displayName,
        inviterName: actor.displayName,
        role: user.role,
        link: `${this.settings.siteUrl}/welcome/${token}`,
        expiresAt,
        hours: this.hours,
      }),
    });
  }

  /** Sends an invitation again: a new link, the old one void. Only for an active account without a password. */
  async resend(actor: CurrentUser, userId: number): Promise<void> {
    await this.dataSource.transaction(async (manager) => {
      const user = await manager
        .getRepository(UserEntity)
        .findOne({ where: { id: userId }, lock: { mode: 'pessimistic_write' } });
      if (!user) throw notFound('That user');
      if (user.passwordHash !== null) {
        throw conflict('invitation_not_needed', 'This person has already set a password: there is nothing to accept.');
      }
      if (!user.active) {
        throw conflict(
          'account_deactivated',
          'This account is deactivated. Reactivate it first, then send the invitation again.',
        );
      }
      await this.issue(manager, user, actor);
      await recordAction(manager, actor, 'user.invitation_sent', ['user', user.id], { email: user.email, again: true });
    });
  }

  /** The account an open invitation is for, or a clear refusal (unknown, used, expired). */
  async lookup(token: string, attempt: PasswordAttempt, now = new Date()): Promise<Invitation> {
    const user = await this.dataSource
      .getRepository(UserEntity)
      .findOneBy({ inviteTokenHash: hashInvitationToken(token) });
    const problem = this.problem(user, now);
    await attempt.settle(problem === null);
    if (problem) throw problem;
    const open = user as UserEntity;
    return {
      displayName: open.displayName,
      email: open.email,
      role: open.role,
      expiresAt: (open.inviteExpiresAt as Date).toISOString(),
    };
  }

  /**
   * Sets the invited person's first password and marks the link used, in one transaction; the caller then opens
   * their session.
   */
  async accept(
    token: string,
    input: AcceptInvitationRequest,
    attempt: PasswordAttempt,
    now = new Date(),
  ): Promise<UserEntity> {
    const tokenHash = hashInvitationToken(token);
    const found = await this.dataSource.getRepository(UserEntity).findOneBy({ inviteTokenHash: tokenHash });
    const problem = this.problem(found, now);
    await attempt.settle(problem === null);
    if (problem) throw problem;
    const passwordHash = await hashPassword(input.newPassword);
    return this.dataSource.transaction(async (manager) => {
      const repo = manager.getRepository(UserEntity);
      // Read again under a lock: two tabs submitting the same link at once set one password, the other is refused.
      const user = await repo.findOne({ where: { inviteTokenHash: tokenHash }, lock: { mode: 'pessimistic_write' } });
      const late = this.problem(user, new Date());
      if (late) throw late;
      const invited = user as UserEntity;
      await repo.update({ id: invited.id }, { passwordHash, inviteAcceptedAt: now, inviteExpiresAt: null });
      await manager.getRepository(SessionEntity).delete({ userId: invited.id });
      await recordAction(manager, invited, 'user.invitation_accepted', ['user', invited.id]);
      return repo.findOneByOrFail({ id: invited.id });
    });
  }

  private problem(user: UserEntity | null, now: Date): AppError | null {
    if (!user || !user.active) return unknownLink();
    if (user.inviteAcceptedAt || user.passwordHash !== null) return usedLink();
    if (!user.inviteExpiresAt || user.inviteExpiresAt.getTime() <= now.getTime()) return expiredLink();
    return null;
  }
}
