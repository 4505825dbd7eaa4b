// Creates the database if needed, runs migrations and optionally seeds the demo once. Used by the
// setup-database command line and by the production start (server/start-production.ts), which runs it in the
// server's own process so a start costs one Node.js boot, not two.
import { createConnection } from 'mysql2/promise';
import { connectionOptions, createDataSource, initializeDataSource } from './data-source';
import { seedDemoOnce } from './seed/demo-seed';
import { createFileStore } from './storage/create-file-store';
import { loadEnv } from './env';
import { demoAccounts } from './seed/demo-staff';

/** A problem with the database's configuration that the operator can fix; said in one sentence, no stack. */
export class DatabaseSetupError extends Error {}

export interface DatabaseSetupOptions {
  /** Drop the database and stop. */
  drop?: boolean;
  /** Drop and recreate the database first (throwaway test databases). */
  fresh?: boolean;
  /** Seed the demo outlet into an empty database and print the demo accounts. */
  seed?: boolean;
  /** With `seed`: do not print the demo accounts. */
  quiet?: boolean;
}

/** MariaDB 10.6 or newer, from `SELECT VERSION()` (e.g. "10.11.6-MariaDB-0+deb12u1"). */
export function supportedServer(version: string): boolean {
  const match = /^(\d+)\.(\d+)\./.exec(version);
  if (!match || !/mariadb/i.test(version)) return false;
  const [major, minor] = [Number(match[1]), Number(match[2])];
  return major > 10 || (major === 10 && minor >= 6);
}

export async function setUpDatabase(url: string | undefined, options: DatabaseSetupOptions = {}) {
  if (!url) throw new DatabaseSetupError('DATABASE_URL is not set (npm start sets it for the private MariaDB).');
  const { database, ...server } = connectionOptions(url);
  if (!/^[A-Za-z0-9_]+$/.test(database)) {
    throw new DatabaseSetupError(`Database name "${database}" may only contain letters, digits and underscores.`);
  }

  const { username, ...rest } = server;
  const admin = await createConnection({ ...rest, user: username });
  const [[{ version }]] = (await admin.query('SELECT VERSION() AS version')) as unknown as [[{ version: string }]];
  if (!supportedServer(version)) {
    await admin.end();
    throw new DatabaseSetupError(
      `Benchwire needs MariaDB 10.6 or newer (for SELECT … FOR UPDATE SKIP LOCKED); the server at ${rest.host}:${rest.port} reports ${version}.`,
    );
  }
  if (options.drop || options.fresh) await admin.query(`DROP DATABASE IF EXISTS \`${database}\``);
  if (!options.drop) {
    await admin.query(`CREATE DATABASE IF NOT EXISTS \`${database}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  }
  await admin.end();
  if (options.drop) return;

  const dataSource = await initializeDataSource(createDataSource(url));
  try {
    const applied = await dataSource.runMigrations({ transaction: 'each' });
    if (applied.length)
      console.log(`[setup] applied ${applied.length} migration(s): ${applied.map((m) => m.name).join(', ')}`);
    if (options.seed) {
      const seeded = await seedDemoOnce(dataSource, createFileStore(loadEnv({ ...process.env, DATABASE_URL: url })));
      if (seeded) console.log('[setup] seeded the demo outlet (The Soak Sheet)');
      if (!options.quiet) {
        console.log('\nDemo accounts (invented outlet "The Soak Sheet"):');
        for (const account of demoAccounts) {
          console.log(`  ${account.role.padEnd(7)} ${account.email.padEnd(28)} password: ${account.password}`);
        }
        console.log('');
      }
    }
  } finally {
    await dataSource.destroy();
  }
}
