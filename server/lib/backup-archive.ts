// One archive holds everything an outlet needs to come back after losing its server: a consistent dump of the
// database and the uploaded files (logger files kept as evidence, photos and their web sizes).
//
// Order matters for consistency: the dump is taken first, inside one transaction (`--single-transaction`: an
// InnoDB snapshot, no table locks, the app keeps working), then the uploads are packed. Files are written before
// the rows that name them and never changed afterwards, so every file a dumped row names is already on disk when
// the uploads are read. A file deleted in between would be missing; the archive may also hold files newer than
// the dump, which nothing names (harmless).
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { cp, mkdir, mkdtemp, readFile, readdir, rename, rm, stat, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { basename, join, resolve } from 'node:path';
import { createConnection } from 'mysql2/promise';
import { connectionOptions } from '../data-source';
import { clientConnection, findMariadbTool, runTool } from './mariadb-tools';

const FORMAT = 'benchwire-backup';
const FORMAT_VERSION = 1;

interface BackupManifest {
  format: typeof FORMAT;
  version: number;
  createdAt: string;
  database: string;
  /** Whether the archive holds an `uploads/` folder (not when files live in S3-compatible storage). */
  uploads: boolean;
}

/** A restore that would mix a backup into existing data: refused before anything is changed. */
export class RestoreRefused extends Error {}

/** `benchwire-backup-20261203T090102Z.tar.gz`: sorts by date, no characters a shell or Windows would mind. */
export function archiveName(createdAt: Date): string {
  return `benchwire-backup-${createdAt
    .toISOString()
    .replace(/[-:]/g, '')
    .replace(/\.\d+Z$/, 'Z')}.tar.gz`;
}

function tar(args: string[]) {
  const result = spawnSync('tar', args, { encoding: 'utf8' });
  if (result.error) throw new Error(`tar could not run: ${result.error.message}`);
  if (result.status !== 0) throw new Error(`tar failed (exit ${result.status}): ${result.stderr.trim()}`);
}

async function countFiles(dir: string): Promise<number> {
  if (!existsSync(dir)) return 0;
  const entries = await readdir(dir, { recursive: true, withFileTypes: true });
  return entries.filter((entry) => entry.isFile()).length;
}

export interface BackupResult {
  file: string;
  bytes: number;
  uploadFiles: number;
}

/**
 * Writes `<outDir>/benchwire-backup-<date>.tar.gz` with `manifest.json`, `database.sql` and `uploads/`.
 * `uploadsDir` is null when files live in object storage (back the bucket up with the provider's versioning).
 */
export async function createBackup(options: {
  databaseUrl: string;
  uploadsDir: string | null;
  outDir: string;
  now?: Date;
}): Promise<BackupResult> {
  const createdAt = options.now ?? new Date();
  const connection = clientConnection(options.databaseUrl);
  const staging = await mkdtemp(join(tmpdir(), 'benchwire-backup-'));
  try {
    await runTool(
      findMariadbTool(['mariadb-dump', 'mysqldump']),
      [
        ...connection.args,
        '--single-transaction',
        '--quick',
        '--routines',
        '--triggers',
        '--hex-blob',
        '--default-character-set=utf8mb4',
        '--no-tablespaces',
        '--skip-add-locks',
        connection.database,
      ],
      { env: connection.env, outputFile: join(staging, 'database.sql') },
    );
    const uploadsDir = options.uploadsDir ? resolve(options.uploadsDir) : null;
    const withUploads = uploadsDir !== null && existsSync(uploadsDir);
    const manifest: BackupManifest = {
      format: FORMAT,
      version: FORMAT_VERSION,
      createdAt: createdAt.toISOString(),
      database: connection.database,
      uploads: withUploads,
    };
    await writeFile(join(staging, 'manifest.json'), `${JSON.stringify(manifest, null, 2)}\n`);

    await mkdir(options.outDir, { recursive: true });
    const file = resolve(options.outDir, archiveName(createdAt));
    const partial = `${file}.partial`;
    tar([
      '-czf',
      partial,
      '-C',
      staging,
      'manifest.json',
      'database.sql',
      // The uploads folder goes in as `uploads/`, whatever it is called on this machine; half-written files
      // (the local store's `.partial` names) stay out.
      ...(withUploads ? ['--exclude=*.partial', '-C', uploadsDir, '--transform=s,^\\.,uploads,', '.'] : []),
    ]);
    await rename(partial, file);
    return {
      file,
      bytes: (await stat(file)).size,
      uploadFiles: withUploads ? await countFiles(uploadsDir) : 0,
    };
  } finally {
    await rm(staging, { recursive: true, force: true });
  }
}

/** Names in the folder apart from hidden ones (`.gitkeep`). */
async function visibleEntries(dir: string): Promise<string[]> {
  if (!existsSync(dir)) return [];
  return (await readdir(dir)).filter((name) => !name.startsWith('.'));
}

export interface RestoreResult {
  database: string;
  tables: number;
  uploadFiles: number;
  createdAt: string;
}

/**
 * Restores an archive into an empty database (created when missing) and an empty uploads folder. A database
 * that holds any table, or an uploads folder that holds any file, is refused before anything is changed.
 */
export async function restoreBackup(options: {
  file: string;
  databaseUrl: string;
  uploadsDir: string | null;
}): Promise<RestoreResult> {
  if (!existsSync(options.file)) throw new RestoreRefused(`There is no backup file at ${options.file}.`);
  const { database, host, port, username, password } = connectionOptions(options.databaseUrl);
  if (!/^[A-Za-z0-9_]+$/.test(database)) {
    throw new RestoreRefused(`Database name "${database}" may only contain letters, digits and underscores.`);
  }
  const uploadsDir = options.uploadsDir ? resolve(options.uploadsDir) : null;
  const server = { host, port, user: username, password };
  const countTables = async () => {
    const connection = await createConnection(server);
    try {
      const [rows] = (await connection.query(
        'SELECT COUNT(*) AS tables FROM information_schema.TABLES WHERE TABLE_SCHEMA = ?',
        [database],
      )) as unknown as [{ tables: number }[]];
      return Number(rows[0].tables);
    } finally {
      await connection.end();
    }
  };

  const staging = await mkdtemp(join(tmpdir(), 'benchwire-restore-'));
  try {
    // GNU tar refuses member names with `..` or a leading `/` by itself; owners and modes come from this user.
    tar(['-xzf', resolve(options.file), '-C', staging, '--no-same-owner', '--no-same-permissions']);
    const manifest = await readManifest(staging, options.file);

    const existing = await countTables();
    if (existing > 0) {
      throw new RestoreRefused(
        `The database "${database}" already holds ${existing} tables. Restore only into an empty database: ` +
          'create a new one and point DATABASE_URL at it, or drop this one first.',
      );
    }
    const present = uploadsDir ? await visibleEntries(uploadsDir) : [];
    if (present.length > 0) {
      throw new RestoreRefused(
        `The uploads folder ${uploadsDir} is not empty (${present.slice(0, 3).join(', ')}${present.length > 3 ? ', …' : ''}). ` +
          'Restore into an empty folder: move its contents away or set UPLOADS_DIR to a new folder.',
      );
    }

    const admin = await createConnection(server);
    try {
      await admin.query(
        `CREATE DATABASE IF NOT EXISTS \`${database}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`,
      );
    } finally {
      await admin.end();
    }
    const connection = clientConnection(options.databaseUrl);
    await runTool(
      findMariadbTool(['mariadb', 'mysql']),
      [...connection.args, '--default-character-set=utf8mb4', '--binary-mode', database],
      { env: connection.env, inputFile: join(staging, 'database.sql') },
    );

    const restoredUploads = join(staging, 'uploads');
    let uploadFiles = 0;
    if (uploadsDir && manifest.uploads && existsSync(restoredUploads)) {
      await mkdir(uploadsDir, { recursive: true });
      await cp(restoredUploads, uploadsDir, { recursive: true, force: false, errorOnExist: true });
      uploadFiles = await countFiles(restoredUploads);
    }
    return { database, tables: await countTables(), uploadFiles, createdAt: manifest.createdAt };
  } finally {
    await rm(staging, { recursive: true, force: true });
  }
}

async function readManifest(staging: string, file: string): Promise<BackupManifest> {
  const path = join(staging, 'manifest.json');
  const manifest = existsSync(path) ? (JSON.parse(await readFile(path, 'utf8')) as Partial<BackupManifest>) : null;
  if (manifest?.format !== FORMAT || !existsSync(join(staging, 'database.sql'))) {
    throw new RestoreRefused(`${basename(file)} is not a Benchwire backup (no manifest.json and database.sql).`);
  }
  if ((manifest.version ?? 0) > FORMAT_VERSION) {
    throw new RestoreRefused(
      `${basename(file)} was written by a newer Benchwire (backup format ${manifest.version}); update first.`,
    );
  }
  return manifest as BackupManifest;
}
