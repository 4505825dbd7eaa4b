/** MariaDB's duplicate-key error (a unique index refused the row). */
export function isDuplicateKey(error: unknown): boolean {
  const driverError = (error as { code?: string; driverError?: { code?: string } }) ?? {};
  return driverError.code === 'ER_DUP_ENTRY' || driverError.driverError?.code === 'ER_DUP_ENTRY';
}
