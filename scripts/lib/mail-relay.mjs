// The local mail relay (server/cli/mail-relay.ts) for `npm start`, `npm run dev` and `npm test`: started on a free
// port of 127.0.0.1 unless SMTP_URL names a real relay; the app then sends through it and shows its dev inbox.
import { spawn } from 'node:child_process';
import { connect, createServer } from 'node:net';
import { resolve } from 'node:path';
import { projectRoot } from './setup.mjs';

/** A port of 127.0.0.1 free right now (the OS picks it). */
export function freePort() {
  return new Promise((resolvePort, reject) => {
    const server = createServer();
    server.unref();
    server.on('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address();
      server.close(() => resolvePort(port));
    });
  });
}

function answers(port) {
  return new Promise((resolveAnswer) => {
    const socket = connect(port, '127.0.0.1');
    socket.once('connect', () => {
      socket.destroy();
      resolveAnswer(true);
    });
    socket.once('error', () => resolveAnswer(false));
  });
}

/**
 * Starts the relay keeping messages in env.DATABASE_URL's database; `built` runs dist/server/mail-relay.js, otherwise
 * the TypeScript through tsx. Returns null when env.SMTP_URL is set, else { url, env, child } where env holds what
 * the app server needs (SMTP_URL and LOCAL_MAIL_RELAY).
 */
export async function startMailRelay(env, { built }) {
  if (env.SMTP_URL) {
    console.log('[setup] sending mail through the relay SMTP_URL names (no local relay, no dev inbox)');
    return null;
  }
  const port = env.MAIL_RELAY_PORT ?? String(await freePort());
  const command = built
    ? [process.execPath, ['--enable-source-maps', 'dist/server/mail-relay.js']]
    : [resolve(projectRoot, 'node_modules', '.bin', 'tsx'), ['server/cli/mail-relay.ts']];
  const child = spawn(command[0], command[1], {
    cwd: projectRoot,
    stdio: 'inherit',
    env: { ...env, MAIL_RELAY_PORT: port },
  });
  const deadline = Date.now() + 30_000;
  while (!(await answers(Number(port)))) {
    if (child.exitCode !== null) throw new Error(`the local mail relay stopped (exit ${child.exitCode})`);
    if (Date.now() > deadline) {
      child.kill('SIGTERM');
      throw new Error('the local mail relay did not start within 30 s');
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  const url = `smtp://127.0.0.1:${port}`;
  return { url, child, env: { SMTP_URL: url, LOCAL_MAIL_RELAY: 'true' } };
}
