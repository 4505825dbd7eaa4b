import { IsNull, Not } from 'typeorm';

/** MariaDB's duplicate-key error (a unique index refused the row). */
export function isDuplicateKey(error: unknown): boolean {
  const driverError = (error as { code?: string; driverError?: { code?: string } }) ?? {};
  return driverError.code === 'ER_DUP_ENTRY' || driverError.driverError?.code === 'ER_DUP_ENTRY';
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
