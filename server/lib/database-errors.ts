import { IsNull, Not } from 'typeorm';

/** MariaDB's duplicate-key error (a unique index refused the row). */
export function isDuplicateKey(error: unknown): boolean {
  const driverError = (error as { code?: string; driverError?: { code?: string } }) ?? {};
  return driverError.code === 'ER_DUP_ENTRY' || driverError.driverError?.code === 'ER_DUP_ENTRY';
}

/**
 * Runs `transaction` again when InnoDB picked it as a deadlock victim (errno 1213, "try restarting transaction":
 * the transaction was rolled back whole, so running it again is safe), at most `attempts` times in all.
 */
export async function retryingDeadlocks<T>(transaction: () => Promise<T>, attempts = 3): Promise<T> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await transaction();
    } catch (error) {
      const deadlock = (error as { driverError?: { errno?: number } })?.driverError?.errno === 1213;
      if (!deadlock || attempt >= attempts) throw error;
    }
  }
}

/** TypeORM `where` for lists that can hide, include or show only archived rows. */
export function archivedWhere(archived: 'exclude' | 'include' | 'only') {
  if (archived === 'exclude') return { archivedAt: IsNull() };
  if (archived === 'only') return { archivedAt: Not(IsNull()) };
  return {};
}

/** Runs a write that a unique index may refuse; that refusal becomes `taken()` (a 409 naming the field). */
export async function refusingDuplicates<T>(write: () => Promise<T>, taken: () => Error): Promise<T> {
  try {
    return await write();
  } catch (error) {
    if (isDuplicateKey(error)) throw taken();
    throw error;
  }
}

/**
 * Driver and server codes meaning the database cannot be reached or is going away — not that the request was wrong:
 * refused or dropped connections, timeouts opening one or waiting for a pooled one, a server shutting down
 * (ER_SERVER_SHUTDOWN 1053, ER_CONNECTION_KILLED 1927, ER_QUERY_INTERRUPTED 1317 as a shutdown interrupts queries),
 * too many connections (1040). Names and numbers: MariaDB error reference and mysql2's error codes (from memory).
 */
const unavailableCodes = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EPIPE',
  'EHOSTUNREACH',
  'ENETUNREACH',
  'ENOTFOUND',
  'EAI_AGAIN',
  'PROTOCOL_CONNECTION_LOST',
  'PROTOCOL_SEQUENCE_TIMEOUT',
  'POOL_ACQUIRE_TIMEOUT',
  'POOL_CLOSED',
  'ER_SERVER_SHUTDOWN',
  'ER_CONNECTION_KILLED',
  'ER_QUERY_INTERRUPTED',
  'ER_CON_COUNT_ERROR',
]);

/** True when the error (or the driver error TypeORM wraps) says the database is out of reach, not the request. */
export function isDatabaseUnavailable(error: unknown): boolean {
  for (let current = error as DriverErrorLike | undefined, depth = 0; current && depth < 4; depth++) {
    if (typeof current.code === 'string' && unavailableCodes.has(current.code)) return true;
    // mysql2 marks errors that ended the connection as fatal, and refuses commands on a connection already closed.
    if (current.fatal === true) return true;
    if (typeof current.message === 'string' && /connection is in closed state/i.test(current.message)) return true;
    current = current.driverError ?? (current.cause as DriverErrorLike | undefined);
  }
  return false;
}

type DriverErrorLike = {
  code?: unknown;
  fatal?: unknown;
  message?: unknown;
  driverError?: DriverErrorLike;
  cause?: unknown;
};
