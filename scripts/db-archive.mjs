#!/usr/bin/env node
// `npm run db:backup` and `npm run db:restore -- <file>`: the database named by DATABASE_URL, or the private
// MariaDB (started for the occasion when it is not running), and the uploads folder.
import { spawnSync } from 'node:child_process';
import { resolve } from 'node:path';
import { ensureDebianPackages } from './lib/mariadb.mjs';
import { ensureDatabaseOrExit, projectRoot } from './lib/setup.mjs';

const [command, ...args] = process.argv.slice(2);
ensureDebianPackages(['mariadb-client'], ['mariadb-dump', 'mysqldump']);
const database = await ensureDatabaseOrExit('backup');
const result = spawnSync(
  resolve(projectRoot, 'node_modules', '.bin', 'tsx'),
  ['server/cli/backup.ts', command, ...args],
  {
    cwd: projectRoot,
    stdio: 'inherit',
    env: { ...process.env, DATABASE_URL: database.url },
  },
);
if (database.startedHere) await database.stop();
process.exit(result.status ?? 1);
