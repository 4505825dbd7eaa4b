// Creates the database if needed, runs migrations and (with --seed) seeds the demo once.
//   --fresh  drop and recreate the database first (throwaway test databases)
//   --drop   drop the database and stop
import { createConnection } from 'mysql2/promise';
import { connectionOptions, createDataSource, initializeDataSource } from '../data-source';
import { seedDemoOnce } from '../seed/demo-seed';
import { demoAccounts } from '../seed/demo-staff';

const args = new Set(process.argv.slice(2));
const url = process.env.DATABASE_URL;
if (!url) {
  console.error('DATABASE_URL is not set (npm start sets it for the private MariaDB).');
  process.exit(1);
}
const { database, ...server } = connectionOptions(url);
if (!/^[A-Za-z0-9_]+$/.test(database)) {
  console.error(`Database name "${database}" may only contain letters, digits and underscores.`);
  process.exit(1);
}

const { username, ...rest } = server;
const admin = await createConnection({ ...rest, user: username });
if (args.has('--drop') || args.has('--fresh')) await admin.query(`DROP DATABASE IF EXISTS \`${database}\``);
if (!args.has('--drop')) {
  await admin.query(`CREATE DATABASE IF NOT EXISTS \`${database}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
}
await admin.end();
if (args.has('--drop')) process.exit(0);

const dataSource = await initializeDataSource(createDataSource(url));
const applied = await dataSource.runMigrations({ transaction: 'each' });
if (applied.length)
  console.log(`[setup] applied ${applied.length} migration(s): ${applied.map((m) => m.name).join(', ')}`);
if (args.has('--seed')) {
  const seeded = await seedDemoOnce(dataSource);
  if (seeded) console.log('[setup] seeded the demo outlet (The Soak Sheet)');
  if (!args.has('--quiet')) {
    console.log('\nDemo accounts (invented outlet "The Soak Sheet"):');
    for (const account of demoAccounts) {
      console.log(`  ${account.role.padEnd(7)} ${account.email.padEnd(28)} password: ${account.password}`);
    }
    console.log('');
  }
}
await dataSource.destroy();
