// `npm run drill:mail`: the mail fault drill of tests/server/mail at 5,000 confirmed subscribers (the suite runs it
// at 2,000): a go-live mailing through the local relay, which fails temporarily part-way, with the sender process
// killed by SIGKILL mid-send and started again. Every confirmed subscriber must end with exactly one message. Runs
// the same test with MAIL_DRILL_CONFIRMED set, in a database of its own (dropped afterwards), and prints its figures.
// Needs DATABASE_URL naming a MariaDB server. MAIL_DRILL_CONFIRMED overrides the 5,000.
import { spawnSync } from 'node:child_process';
import { resolve } from 'node:path';
import { scratchDatabaseUrl } from './lib/app-process';

const url = scratchDatabaseUrl('benchwire_test_drill', 'the drill');
const env = {
  ...process.env,
  DATABASE_URL: url.toString(),
  NODE_ENV: 'test',
  MAIL_DRILL_CONFIRMED: process.env.MAIL_DRILL_CONFIRMED ?? '5000',
};
const setup = (flag: string) =>
  spawnSync(resolve('node_modules/.bin/tsx'), ['server/cli/setup-database.ts', flag, '--quiet'], {
    env,
    stdio: 'inherit',
  });

if (setup('--fresh').status !== 0) process.exit(1);
const started = Date.now();
const drill = spawnSync(
  resolve('node_modules/.bin/vitest'),
  ['run', 'tests/server/mail/outbox.test.ts', '-t', 'mail fault drill', '--silent=false', '--reporter=dot'],
  { env, stdio: 'inherit' },
);
console.log(`Drill ${drill.status === 0 ? 'passed' : 'FAILED'} in ${((Date.now() - started) / 1000).toFixed(0)} s`);
setup('--drop');
process.exit(drill.status ?? 1);
