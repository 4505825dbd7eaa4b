import type { DataSource } from 'typeorm';
import { UserEntity } from '../entities/user.entity';
import { SessionEntity } from '../entities/session.entity';
import { hashPassword } from '../auth/passwords';
import { AppError, conflict, notFound } from '../errors';
import { recordAction } from './audit.service';
import { isDuplicateKey } from '../lib/database-errors';
import type { InvitationsService } from './invitations.service';
import type { CreateUserRequest, UpdateUserRequest, User } from '../../shared/schemas/users';
import type { CurrentUser } from '../../shared/schemas/auth';

export function toUserDto(user: UserEntity, now = new Date()): User {
  return {
    id: user.id,
    email: user.email,
    displayName: user.displayName,
    role: user.role,
    active: Boolean(user.active),
    createdAt: user.createdAt.toISOString(),
    updatedAt: user.updatedAt.toISOString(),
    lastSignInAt: user.lastSignInAt ? user.lastSignInAt.toISOString() : null,
    passwordSet: user.passwordHash !== null,
    invitation:
      user.passwordHash === null && user.inviteTokenHash && user.inviteExpiresAt && user.inviteSentAt
        ? {
            sentAt: user.inviteSentAt.toISOString(),
            expiresAt: user.inviteExpiresAt.toISOString(),
            expired: user.inviteExpiresAt.getTime() <= now.getTime(),
          }
        : null,
  };
}

const emailTaken = () =>
  conflict('email_taken', 'Another account already uses this e-mail address.', {
    email: 'Another account already uses this e-mail address.',
  });

export class UsersService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly invitations: InvitationsService,
  ) {}

  async list(): Promise<User[]> {
    const users = await this.dataSource.getRepository(UserEntity).find({ order: { displayName: 'ASC' } });
    return users.map((user) => toUserDto(user));
  }

  async get(id: number): Promise<User> {
    const user = await this.dataSource.getRepository(UserEntity).findOneBy({ id });
    if (!user) throw notFound('That user');
    return toUserDto(user);
  }

  /** With a password the account can sign in at once; without one its owner is invited by mail to set their own. */
  async create(actor: CurrentUser, input: CreateUserRequest): Promise<User> {
    const passwordHash = input.password ? await hashPassword(input.password) : null;
    try {
      return await this.dataSource.transaction(async (manager) => {
        const repo = manager.getRepository(UserEntity);
        const { identifiers } = await repo.insert({
          email: input.email,
          displayName: input.displayName,
          role: input.role,
          passwordHash,
          active: true,
        });
        let user = await repo.findOneByOrFail({ id: identifiers[0].id });
        if (!passwordHash) {
          await this.invitations.issue(manager, user, actor);
          user = await repo.findOneByOrFail({ id: user.id });
        }
        await recordAction(manager, actor, 'user.created', ['user', user.id], {
          email: user.email,
          role: user.role,
          ...(user.inviteExpiresAt ? { invitedUntil: user.inviteExpiresAt.toISOString() } : {}),
        });
        return toUserDto(user);
      });
    } catch (error) {
      if (isDuplicateKey(error)) throw emailTaken();
      throw error;
    }
  }

  async update(actor: CurrentUser, id: number, input: UpdateUserRequest): Promise<User> {
    if (id === actor.id && (input.active === false || (input.role && input.role !== 'admin'))) {
      throw new AppError('self_lockout', 409, 'You cannot deactivate yourself or remove your own admin role.');
    }
    const passwordHash = input.password ? await hashPassword(input.password) : undefined;
    try {
      return await this.dataSource.transaction(async (manager) => {
        const repo = manager.getRepository(UserEntity);
        const user = await repo.findOne({ where: { id }, lock: { mode: 'pessimistic_write' } });
        if (!user) throw notFound('That user');
        const changes: Record<string, unknown> = {};
        for (const key of ['email', 'displayName', 'role', 'active'] as const) {
          if (input[key] !== undefined && input[key] !== user[key]) {
            changes[key] = { from: user[key], to: input[key] };
            (user as unknown as Record<string, unknown>)[key] = input[key];
          }
        }
        if (passwordHash) {
          user.passwordHash = passwordHash;
          changes.password = 'reset by admin';
        }
        // A deactivated account, or one whose password the admin has set, has no invitation to accept any more.
        if (user.inviteTokenHash && user.inviteAcceptedAt === null && (!user.active || passwordHash)) {
          user.inviteTokenHash = null;
          user.inviteExpiresAt = null;
          changes.invitation = 'withdrawn';
        }
        await repo.save(user);
        // Deactivation, a role change and a password reset all end the user's sessions at once.
        if (changes.active || changes.role || changes.password) {
          await manager.getRepository(SessionEntity).delete({ userId: id });
        }
        await recordAction(manager, actor, 'user.updated', ['user', id], changes);
        return toUserDto(await repo.findOneByOrFail({ id }));
      });
    } catch (error) {
      if (isDuplicateKey(error)) throw emailTaken();
      throw error;
    }
  }
}
