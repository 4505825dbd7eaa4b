// Creates the database if needed, runs migrations and optionally seeds the demo once. Used by the
// setup-database command line and by the production start (server/start-production.ts), which runs it in the
// server's own process so a start costs one Node.js boot, not two.
import { createConnection } from 'mysql2/promise';
import { connectionOptions, createDataSource, initializeDataSource } from './data-source';
import { seedDemoOnce } from './seed/demo-seed';
import { demoAccounts } from './seed/demo-staff';

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

export async function setUpDatabase(url: string | undefined, options: DatabaseSetupOptions = {}) {
  if (!url) throw new Error('DATABASE_URL is not set (npm start sets it for the private MariaDB).');
  const { database, ...server } = connectionOptions(url);
  if (!/^[A-Za-z0-9_]+$/.test(database)) {
    throw new Error(`Database name "${database}" may only contain letters, digits and underscores.`);
  }

  const { username, ...rest } = server;
  const admin = await createConnection({ ...rest, user: username });
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
      const seeded = await seedDemoOnce(dataSource);
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
