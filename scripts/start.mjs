#!/usr/bin/env node
// `npm start`: install, start a private MariaDB, migrate, seed once, build, serve.
// `npm run dev`: the same database, with Vite's dev server and an API server that restarts on change.
import { ensureDatabase, ensureDependencies, runStep, startProcess } from './lib/setup.mjs';

const dev = process.argv.includes('--dev');

ensureDependencies();
const database = await ensureDatabase();
const env = { ...process.env, DATABASE_URL: database.url, NODE_ENV: dev ? 'development' : 'production' };

let children = [];
let stopping = false;
async function shutdown(code) {
  if (stopping) return;
  stopping = true;
  for (const child of children) child.kill('SIGTERM');
  await Promise.all(
    children.map((child) => new Promise((r) => (child.exitCode !== null ? r() : child.once('exit', r)))),
  );
  if (database.startedHere) {
    console.log('[setup] stopping the private MariaDB');
    await database.stop();
  }
  process.exit(code);
}
process.on('SIGINT', () => shutdown(0));
process.on('SIGTERM', () => shutdown(0));

try {
  runStep('tsx', ['server/cli/setup-database.ts', '--seed'], env);
  if (dev) {
    children.push(
      startProcess('tsx', ['watch', '--clear-screen=false', 'server/index.ts'], {
        ...env,
        PORT: env.API_PORT ?? '3001',
      }),
    );
    children.push(startProcess('vite', [], env));
  } else {
    runStep('vite', ['build', '--logLevel', 'warn'], env);
    children.push(startProcess('tsx', ['server/index.ts'], env));
  }
  for (const child of children) child.on('exit', (code) => shutdown(code ?? 0));
} catch (error) {
  console.error(`[setup] ${error.message}`);
  await shutdown(error.exitCode ?? 1);
}
