import { AppError } from '../errors';

/** Error codes of a file system that has no room left (ENOSPC) or a quota that is used up (EDQUOT). */
const fullCodes = new Set(['ENOSPC', 'EDQUOT']);

/**
 * A failed write to the file store as the error the client sees: 507 `storage_full` when the disk (or quota) is full,
 * 503 `storage_unavailable` for anything else (a read-only or re-permissioned folder, an unreachable bucket). The
 * original error goes to the server log, where the person who can fix it looks; the client is told nothing was kept.
 */
export function storageWriteError(error: unknown, driver: 'local' | 's3'): AppError {
  if (error instanceof AppError) return error;
  const code = String((error as NodeJS.ErrnoException)?.code ?? (error as { name?: string })?.name ?? 'unknown');
  console.error(`[storage] a write to the ${driver} file store failed: ${(error as Error)?.message ?? code}`);
  if (fullCodes.has(code)) {
    return new AppError(
      'storage_full',
      507,
      'The file store is full, so this upload was not kept and nothing was saved. ' +
        'Ask an administrator to free space, then upload again.',
    );
  }
  return new AppError(
    'storage_unavailable',
    503,
    'The file store cannot be written to just now, so this upload was not kept and nothing was saved. ' +
      'Ask an administrator to check the uploads storage, then upload again.',
  );
}

/** The two answers above, for the API description of routes that keep an uploaded file. */
export const storageWriteErrors = {
  503: { description: 'The file store cannot be written to; nothing was saved (storage_unavailable)' },
  507: { description: 'The file store is full; nothing was saved (storage_full)' },
};
