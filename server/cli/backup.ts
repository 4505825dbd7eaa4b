// `npm run db:backup [-- --out <folder>]`: one dated archive of the database and the uploaded files.
// `npm run db:restore -- <file>`: restores an archive into an empty database and an empty uploads folder.
import { resolve } from 'node:path';
import { loadEnv } from '../env';
import { createBackup, restoreBackup, RestoreRefused } from '../lib/backup-archive';

const [command, ...rest] = process.argv.slice(2);

function option(name: string): string | undefined {
  const index = rest.indexOf(name);
  return index >= 0 ? rest[index + 1] : undefined;
}

try {
  const env = loadEnv();
  const uploadsDir = env.STORAGE_DRIVER === 'local' ? resolve(env.UPLOADS_DIR) : null;
  if (!uploadsDir) {
    console.log('[backup] files live in S3-compatible storage: back the bucket up with its own versioning or copies.');
  }
  if (command === 'backup') {
    const result = await createBackup({
      databaseUrl: env.DATABASE_URL,
      uploadsDir,
      outDir: resolve(option('--out') ?? 'backups'),
    });
    console.log(
      `[backup] wrote ${result.file} (${(result.bytes / 1024).toFixed(0)} KiB: the database and ${result.uploadFiles} uploaded files)`,
    );
  } else if (command === 'restore') {
    const file = rest.find((arg) => !arg.startsWith('--'));
    if (!file)
      throw new RestoreRefused('Name the backup file: npm run db:restore -- backups/benchwire-backup-….tar.gz');
    const result = await restoreBackup({ file: resolve(file), databaseUrl: env.DATABASE_URL, uploadsDir });
    console.log(
      `[restore] restored the backup of ${result.createdAt} into "${result.database}": ${result.tables} tables, ${result.uploadFiles} uploaded files.`,
    );
  } else {
    throw new RestoreRefused('Usage: backup.ts backup [--out <folder>] | restore <file>');
  }
} catch (error) {
  console.error(error instanceof RestoreRefused ? error.message : error instanceof Error ? error.message : error);
  process.exit(1);
}
