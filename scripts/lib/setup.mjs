// Shared steps of `npm start`, `npm run dev` and `npm test`.
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, statSync } from 'node:fs';
import { resolve } from 'node:path';
import { SetupError, startPrivateMariadb } from './mariadb.mjs';

export const projectRoot = resolve(import.meta.dirname, '..', '..');

/** Runs `npm ci` when node_modules is missing or older than package-lock.json. */
export function ensureDependencies() {
  const marker = resolve(projectRoot, 'node_modules', '.package-lock.json');
  const lock = resolve(projectRoot, 'package-lock.json');
  const stale = !existsSync(marker) || (existsSync(lock) && statSync(lock).mtimeMs > statSync(marker).mtimeMs + 1000);
  if (!stale) return;
  console.log('[setup] installing npm dependencies…');
  const args = existsSync(lock) ? ['ci', '--no-audit', '--no-fund'] : ['install', '--no-audit', '--no-fund'];
  const result = spawnSync('npm', args, { cwd: projectRoot, stdio: 'inherit' });
  if (result.status !== 0) process.exit(result.status ?? 1);
}

/** Uses DATABASE_URL when given; otherwise starts (or reuses) the private MariaDB. */
export async function ensureDatabase() {
  if (process.env.DATABASE_URL) {
    console.log('[setup] using the MariaDB server named by DATABASE_URL');
    return { url: process.env.DATABASE_URL, startedHere: false, stop: async () => {} };
  }
  return startPrivateMariadb();
}

/** The database for a command-line script; when there is none, says why (`tag` names the script) and exits 1. */
export async function ensureDatabaseOrExit(tag) {
  try {
    return await ensureDatabase();
  } catch (error) {
    console.error(error instanceof SetupError ? error.message : `[${tag}] ${error.message}`);
    process.exit(1);
  }
}

const bin = (name) => resolve(projectRoot, 'node_modules', '.bin', name);

/** Runs a project binary (from node_modules/.bin) to completion; exits on failure. */
export function runStep(name, args, env = process.env) {
  const result = spawnSync(bin(name), args, { cwd: projectRoot, stdio: 'inherit', env });
  if (result.status !== 0) {
    const error = new Error(`${name} ${args.join(' ')} failed (exit ${result.status})`);
    error.exitCode = result.status ?? 1;
    throw error;
  }
}

/** Starts a long-running project binary. */
export function startProcess(name, args, env = process.env) {
  return spawn(bin(name), args, { cwd: projectRoot, stdio: 'inherit', env });
}

/** Starts a long-running built script with this Node.js. */
export function startNode(args, env = process.env) {
  return spawn(process.execPath, args, { cwd: projectRoot, stdio: 'inherit', env });
}
