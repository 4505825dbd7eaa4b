/** MariaDB's duplicate-key error (a unique index refused the row). */
export function isDuplicateKey(error: unknown): boolean {
  const driverError = (error as { code?: string; driverError?: { code?: string } }) ?? {};
  return driverError.code === 'ER_DUP_ENTRY' || driverError.driverError?.code === 'ER_DUP_ENTRY';
}

/** A foreign key refused a delete because other rows still point at the row. */
export function isRowReferenced(error: unknown): boolean {
  const driverError = (error as { code?: string; driverError?: { code?: string } }) ?? {};
  const code = driverError.code ?? driverError.driverError?.code;
  return code === 'ER_ROW_IS_REFERENCED_2' || code === 'ER_ROW_IS_REFERENCED';
}
