// Slows down password guessing without locking out the account's owner or an office behind one address.
//
// Per account: the first few wrong passwords cost nothing; from then on each attempt starts a short lock that
// doubles with every further wrong password (30 s, 1 min, 2 min … up to a ceiling). While the lock runs every
// attempt, right or wrong, answers 429 without the password being checked; once it has passed, the right
// password signs in and clears the count. So guessing slows to a few tries an hour while the owner waits at
// most one lock. Only wrong passwords count, never successful sign-ins.
// Per client address: a ceiling of wrong passwords within a window, so one machine cannot spread guesses over
// many accounts. Successful sign-ins are not counted, so a whole office behind one address is never blocked by
// signing in.
//
// The counters live in MariaDB so every app server behind a load balancer sees the same ones. An attempt is
// counted as a failure when it is admitted and taken back when the password proves right, so a burst of
// parallel guesses cannot all slip past the check while the first ones are still being verified.
// (express-rate-limit, used before, only has fixed windows: the right password stayed refused until the window
// ended.)
import { createHash } from 'node:crypto';
import type { Response } from 'express';
import { ipKeyGenerator } from 'express-rate-limit';
import { In, type DataSource } from 'typeorm';
import { PasswordGuessCounterEntity } from '../entities/password-guess-counter.entity';
import type { Env } from '../env';
import { AppError } from '../errors';
import { retryingDeadlocks } from '../lib/database-errors';

export interface PasswordGuessPolicy {
  /** Wrong passwords for one account before every further attempt waits for a lock to pass. */
  freeFailures: number;
  /** The first lock; each further wrong password doubles it. */
  firstLockMs: number;
  maxLockMs: number;
  /** Wrong passwords from one client address within `addressWindowMs`. */
  addressFailures: number;
  addressWindowMs: number;
}

/** An account's wrong passwords are forgotten after a day without one (a right one clears them at once). */
const ACCOUNT_MEMORY_MS = 24 * 60 * 60_000;
const PRUNE_EVERY_MS = 10 * 60_000;
const DEADLOCK_RETRIES = 3;

export function passwordGuessPolicy(env: Env): PasswordGuessPolicy {
  return {
    freeFailures: env.SIGN_IN_LIMIT_PER_ACCOUNT,
    firstLockMs: env.SIGN_IN_LOCK_SECONDS * 1000,
    maxLockMs: env.SIGN_IN_LOCK_MAX_MINUTES * 60_000,
    addressFailures: env.SIGN_IN_LIMIT_PER_IP,
    addressWindowMs: env.SIGN_IN_WINDOW_MINUTES * 60_000,
  };
}

/** "45 seconds", "3 minutes", "2 hours": how long to wait, as the 429 message says it. */
export function waitInWords(seconds: number): string {
  const plural = (n: number, unit: string) => `${n} ${unit}${n === 1 ? '' : 's'}`;
  if (seconds < 60) return plural(Math.max(1, Math.ceil(seconds)), 'second');
  if (seconds < 3600) return plural(Math.ceil(seconds / 60), 'minute');
  return plural(Math.ceil(seconds / 3600), 'hour');
}

/** `invitation`: an invitation link's token, counted like a password (per token and per client address). */
export type PasswordCheck = 'sign-in' | 'current-password' | 'invitation';

export interface PasswordAttemptSubject {
  check: PasswordCheck;
  /** The account's e-mail as normalised by the schema (trimmed, lower case); unknown addresses count too. */
  email: string;
  /** The client address (`req.ip`); IPv6 addresses count per /56 network. */
  address: string | null | undefined;
}

/** An admitted attempt: tell it whether the password was right. */
export interface PasswordAttempt {
  settle(correct: boolean): Promise<void>;
}

export class TooManyPasswordGuesses extends AppError {
  constructor(
    message: string,
    readonly retryAfterSeconds: number,
  ) {
    super('rate_limited', 429, message);
  }
}

type Counter = Pick<PasswordGuessCounterEntity, 'failures' | 'windowStartedAt' | 'lockedUntil' | 'updatedAt'>;

const counterKey = (kind: 'account' | 'address', value: string) =>
  createHash('sha256').update(`${kind}:${value}`).digest('hex');

export class PasswordGuesses {
  private lastPrunedAt = 0;

  constructor(
    private readonly dataSource: DataSource,
    private readonly policy: PasswordGuessPolicy,
    private readonly now: () => number = Date.now,
  ) {}

  /** Counts the attempt and returns it, or throws 429 with the time to wait. */
  async admit(subject: PasswordAttemptSubject): Promise<PasswordAttempt> {
    const accountKey = counterKey('account', subject.email);
    const addressKey = subject.address ? counterKey('address', ipKeyGenerator(subject.address)) : null;
    return retryingDeadlocks(() => this.admitOnce(subject.check, accountKey, addressKey), DEADLOCK_RETRIES);
  }

  private async admitOnce(check: PasswordCheck, accountKey: string, addressKey: string | null) {
    const created = new Date(this.now());
    await this.prune(created);
    // Rows are always locked in key order (here and by the SELECT … FOR UPDATE below), so attempts never deadlock
    // on each other. They are created outside the locking transaction: INSERT IGNORE on an existing row takes a
    // shared lock, and two transactions both upgrading theirs would deadlock.
    const keys = (addressKey ? [accountKey, addressKey] : [accountKey]).sort();
    await this.dataSource.query(
      `INSERT IGNORE INTO password_guess_counters (counter_key, kind, failures, window_started_at, locked_until, updated_at)
       VALUES ${keys.map(() => '(?, ?, 0, ?, NULL, ?)').join(', ')}`,
      keys.flatMap((key) => [key, key === accountKey ? 'account' : 'address', created, created]),
    );
    const refusal = await this.dataSource.transaction(async (manager) => {
      const repository = manager.getRepository(PasswordGuessCounterEntity);
      const rows = await repository.find({
        where: { counterKey: In(keys) },
        order: { counterKey: 'ASC' },
        lock: { mode: 'pessimistic_write' },
      });
      // Read after the rows are locked: an attempt that waited for another must not measure from before it.
      const now = new Date(this.now());
      const fresh: Counter = { failures: 0, windowStartedAt: now, lockedUntil: null, updatedAt: now };
      const account = rows.find((row) => row.counterKey === accountKey) ?? fresh;
      const address = addressKey ? (rows.find((row) => row.counterKey === addressKey) ?? { ...fresh }) : null;

      const accountLock = this.accountLock(account, now);
      if (accountLock) {
        const words = waitInWords(accountLock);
        return new TooManyPasswordGuesses(
          check === 'sign-in'
            ? `Too many wrong passwords for this account. Try again in ${words}.`
            : check === 'invitation'
              ? `Too many tries of this invitation link. Try again in ${words}.`
              : `Too many wrong current passwords. Try again in ${words}.`,
          accountLock,
        );
      }
      const addressWait = address ? this.addressCeiling(address, now) : null;
      if (addressWait) {
        return new TooManyPasswordGuesses(
          check === 'invitation'
            ? `Too many invitation links tried from your network. Try again in ${waitInWords(addressWait)}.`
            : `Too many wrong passwords from your network. Try again in ${waitInWords(addressWait)}.`,
          addressWait,
        );
      }

      // Counted as a failure now; settle(true) takes it back.
      const failures = account.failures + 1;
      const lockMs =
        failures >= this.policy.freeFailures
          ? Math.min(this.policy.firstLockMs * 2 ** (failures - this.policy.freeFailures), this.policy.maxLockMs)
          : 0;
      await repository.update(
        { counterKey: accountKey },
        { failures, lockedUntil: lockMs ? new Date(now.getTime() + lockMs) : null, updatedAt: now },
      );
      if (address && addressKey) {
        await repository.update(
          { counterKey: addressKey },
          { failures: address.failures + 1, windowStartedAt: address.windowStartedAt, updatedAt: now },
        );
      }
      return null;
    });
    if (refusal) throw refusal;
    return { settle: (correct: boolean) => (correct ? this.succeeded(accountKey, addressKey) : Promise.resolve()) };
  }

  /** Seconds until the account may try again, or null. Forgets old failures on the way. */
  private accountLock(account: Counter, now: Date): number | null {
    const quietSince = Math.max(account.updatedAt.getTime(), account.lockedUntil?.getTime() ?? 0);
    if (now.getTime() - quietSince >= ACCOUNT_MEMORY_MS) {
      account.failures = 0;
      account.lockedUntil = null;
    }
    if (account.lockedUntil && account.lockedUntil.getTime() > now.getTime()) {
      return Math.ceil((account.lockedUntil.getTime() - now.getTime()) / 1000);
    }
    return null;
  }

  /** Seconds until the address's window ends when it has reached the ceiling, or null. Starts new windows. */
  private addressCeiling(address: Counter, now: Date): number | null {
    const windowEnds = address.windowStartedAt.getTime() + this.policy.addressWindowMs;
    if (windowEnds <= now.getTime()) {
      address.failures = 0;
      address.windowStartedAt = now;
      return null;
    }
    if (address.failures >= this.policy.addressFailures) return Math.ceil((windowEnds - now.getTime()) / 1000);
    return null;
  }

  private async succeeded(accountKey: string, addressKey: string | null) {
    const now = new Date(this.now());
    await this.dataSource.query(
      'UPDATE password_guess_counters SET failures = 0, locked_until = NULL, updated_at = ? WHERE counter_key = ?',
      [now, accountKey],
    );
    if (addressKey) {
      await this.dataSource.query(
        'UPDATE password_guess_counters SET failures = IF(failures > 0, failures - 1, 0) WHERE counter_key = ?',
        [addressKey],
      );
    }
  }

  private async prune(now: Date) {
    if (now.getTime() - this.lastPrunedAt < PRUNE_EVERY_MS) return;
    this.lastPrunedAt = now.getTime();
    const cutoff = new Date(now.getTime() - Math.max(ACCOUNT_MEMORY_MS, this.policy.addressWindowMs));
    await this.dataSource.query(
      `DELETE FROM password_guess_counters
       WHERE updated_at < ? AND (locked_until IS NULL OR locked_until < ?) LIMIT 1000`,
      [cutoff, cutoff],
    );
  }
}

/** For a route: admits a password attempt, or answers 429 with `Retry-After` and the wait in words. */
export async function admitPasswordAttempt(
  guesses: PasswordGuesses,
  subject: PasswordAttemptSubject,
  res: Response,
): Promise<PasswordAttempt> {
  try {
    return await guesses.admit(subject);
  } catch (error) {
    if (error instanceof TooManyPasswordGuesses) res.set('Retry-After', String(error.retryAfterSeconds));
    throw error;
  }
}
