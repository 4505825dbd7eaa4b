#!/usr/bin/env node
// `npm start`: install, start a private MariaDB, build what changed, migrate, seed once, serve the built server
// with plain Node.js.
// `npm run dev`: the same database, with Vite's dev server and an API server that restarts on change (tsx watch).
import { ensureBuilt } from './lib/build.mjs';
import { startMailRelay } from './lib/mail-relay.mjs';
import { SetupError } from './lib/mariadb.mjs';
import { ensureDatabase, ensureDependencies, runStep, startNode, startProcess } from './lib/setup.mjs';

const dev = process.argv.includes('--dev');

let database = null;
let children = [];
let stopping = false;
async function shutdown(code) {
  if (stopping) return;
  stopping = true;
  for (const child of children) child.kill('SIGTERM');
  await Promise.all(
    children.map((child) => new Promise((r) => (child.exitCode !== null ? r() : child.once('exit', r)))),
  );
  if (database?.startedHere) {
    console.log('[setup] stopping the private MariaDB');
    await database.stop();
  }
  process.exit(code);
}
process.on('SIGINT', () => shutdown(0));
process.on('SIGTERM', () => shutdown(0));

try {
  ensureDependencies();
  database = await ensureDatabase();
  const env = { ...process.env, DATABASE_URL: database.url, NODE_ENV: dev ? 'development' : 'production' };
  if (dev) {
    runStep('tsx', ['server/cli/setup-database.ts', '--seed'], env);
    const relay = await startMailRelay(env, { built: false });
    if (relay) {
      children.push(relay.child);
      Object.assign(env, relay.env);
    }
    children.push(
      startProcess('tsx', ['watch', '--clear-screen=false', 'server/index.ts'], {
        ...env,
        PORT: env.API_PORT ?? '3001',
      }),
    );
    children.push(startProcess('vite', [], env));
  } else {
    ensureBuilt(['client', 'server'], env);
    // The server migrates as it starts; until then the relay answers "try again later", which senders honour.
    const relay = await startMailRelay(env, { built: true });
    if (relay) {
      children.push(relay.child);
      Object.assign(env, relay.env);
    }
    // Migrates and seeds in the server's own process, then serves: one Node.js start.
    children.push(startNode(['--enable-source-maps', 'dist/server/start-production.js'], env));
  }
  for (const child of children) child.on('exit', (code) => shutdown(code ?? 0));
} catch (error) {
  console.error(error instanceof SetupError ? error.message : `[setup] ${error.message}`);
  await shutdown(error.exitCode ?? 1);
}
