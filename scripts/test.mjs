#!/usr/bin/env node
// `npm test`: set up what the suite needs (dependencies, Chromium, MariaDB), then lint, typecheck,
// Vitest (unit + API integration on a throwaway database) and Playwright (production build, seeded
// throwaway database), and stop what it started.
import { randomBytes } from 'node:crypto';
import { ensureBuilt } from './lib/build.mjs';
import { freePort, startMailRelay } from './lib/mail-relay.mjs';
import { ensureDebianPackages } from './lib/mariadb.mjs';
import { ensureDatabaseOrExit, ensureDependencies, runStep } from './lib/setup.mjs';

// e.g. `npm test -- unit`, `npm test -- e2e`, or `npm test -- e2e e2e/capture.spec.ts` for chosen specs only.
const args = process.argv.slice(2);
const specs = args.filter((arg) => arg.endsWith('.spec.ts'));
const only = args.filter((arg) => !arg.endsWith('.spec.ts'));
const wants = (step) => only.length === 0 || only.includes(step);

ensureDependencies();
if (wants('e2e')) ensureDebianPackages(['chromium'], ['chromium']);
const database = await ensureDatabaseOrExit('test');

const suffix = `${process.pid}_${randomBytes(3).toString('hex')}`;
const withDatabase = (name) => {
  const url = new URL(database.url);
  url.pathname = `/${name}`;
  return url.toString();
};
const unitUrl = withDatabase(`benchwire_test_unit_${suffix}`);
const e2eUrl = withDatabase(`benchwire_test_e2e_${suffix}`);
const created = [];
let mailRelay = null;

let exitCode = 0;
const started = Date.now();
try {
  if (wants('lint')) {
    console.log('\n== lint and format');
    runStep('eslint', ['.', '--max-warnings=0']);
    runStep('prettier', ['--check', '--log-level=warn', '.']);
  }
  if (wants('typecheck')) {
    console.log('\n== typecheck');
    runStep('tsc', ['--noEmit', '-p', 'tsconfig.json']);
  }
  if (wants('unit')) {
    console.log('\n== vitest (unit and API integration on a throwaway MariaDB database)');
    created.push(unitUrl);
    runStep('tsx', ['server/cli/setup-database.ts', '--fresh'], { ...process.env, DATABASE_URL: unitUrl });
    runStep('vitest', ['run'], { ...process.env, DATABASE_URL: unitUrl, NODE_ENV: 'test' });
    // Scheduling and publishing must not depend on the server's own zone: their files again under two others.
    for (const zone of ['America/Los_Angeles', 'Asia/Kolkata']) {
      console.log(`\n== vitest (time zones, jobs and publishing with TZ=${zone})`);
      runStep('vitest', ['run', 'tests/shared/publishing', 'tests/server/jobs', 'tests/server/publishing'], {
        ...process.env,
        DATABASE_URL: unitUrl,
        NODE_ENV: 'test',
        TZ: zone,
      });
    }
  }
  if (wants('e2e')) {
    console.log('\n== playwright (the built client and server in Debian Chromium on a seeded throwaway database)');
    created.push(e2eUrl);
    runStep('tsx', ['server/cli/setup-database.ts', '--fresh', '--seed', '--quiet'], {
      ...process.env,
      DATABASE_URL: e2eUrl,
    });
    ensureBuilt(['client', 'server']);
    const port = await freePort();
    // The e2e server sends through the local relay, which keeps messages in the e2e database (the dev inbox).
    mailRelay = await startMailRelay({ ...process.env, DATABASE_URL: e2eUrl }, { built: true });
    runStep('playwright', ['test', ...specs], {
      ...process.env,
      ...mailRelay?.env,
      DATABASE_URL: e2eUrl,
      E2E_PORT: String(port),
    });
  }
} catch (error) {
  console.error(`\n[test] ${error.message}`);
  exitCode = error.exitCode ?? 1;
} finally {
  if (mailRelay) {
    mailRelay.child.kill('SIGTERM');
    await new Promise((r) => (mailRelay.child.exitCode !== null ? r() : mailRelay.child.once('exit', r)));
  }
  for (const url of created) {
    try {
      runStep('tsx', ['server/cli/setup-database.ts', '--drop'], { ...process.env, DATABASE_URL: url });
    } catch {
      console.error(`[test] could not drop ${url.replace(/:[^:@/]*@/, ':***@')}`);
    }
  }
  if (database.startedHere) await database.stop();
}
console.log(
  `\n[test] ${exitCode === 0 ? 'all steps passed' : 'FAILED'} in ${Math.round((Date.now() - started) / 1000)} s`,
);
process.exit(exitCode);
