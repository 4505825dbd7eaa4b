/**
 * Benchmark of the published reader pages (issue 10): autocannon on 127.0.0.1 against a published demo roundup page
 * served by the app, and in the same run the same bytes with the same compression (gzip, as both answer
 * `Accept-Encoding: gzip`) served by nginx from Debian as the baseline. Prints requests/s and p99 latency for both
 * and their ratio. Target: at least 0.7× nginx, and p99 under 20 ms, at 64 connections.
 *
 * Both servers get one process (nginx: worker_processes 1; the app: one Node.js process); autocannon runs here.
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { chmodSync, mkdtempSync, mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { get } from 'node:http';
import { createServer } from 'node:net';
import { availableParallelism, loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import autocannon from 'autocannon';
import { createConnection } from 'mysql2/promise';
// @ts-expect-error plain ESM helper of the npm scripts, without types
import { ensureDatabase, projectRoot } from './lib/setup.mjs';

const connections = 64;
const durationSeconds = Number(process.env.BENCH_SECONDS ?? 10);

function freePort(): Promise<number> {
  return new Promise((resolvePort, reject) => {
    const server = createServer();
    server.on('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      server.close(() => resolvePort(typeof address === 'object' && address ? address.port : 0));
    });
  });
}

/** The raw bytes of a response, as sent (no decoding). */
function fetchRaw(url: string, acceptEncoding: string) {
  return new Promise<{ status: number; headers: Record<string, unknown>; body: Buffer }>((done, fail) => {
    get(url, { headers: { 'accept-encoding': acceptEncoding } }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => done({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }));
    }).on('error', fail);
  });
}

async function waitFor(url: string, child: ChildProcess, what: string) {
  const deadline = Date.now() + 120_000;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`${what} exited with ${child.exitCode}`);
    try {
      if ((await fetchRaw(url, 'identity')).status < 500) return;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) throw new Error(`${what} did not answer within two minutes`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

function hasNginx(): boolean {
  return spawnSync('sh', ['-c', 'command -v nginx'], { stdio: 'ignore' }).status === 0;
}

/** nginx from Debian, installed with apt only when missing; false when that is not possible here. */
function ensureNginx(): boolean {
  if (hasNginx()) return true;
  if (typeof process.getuid !== 'function' || process.getuid() !== 0) {
    console.log('[bench] nginx is not installed and this user cannot install it: app figures only.');
    return false;
  }
  console.log('[bench] installing nginx-light from Debian for the baseline…');
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  spawnSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
  spawnSync('apt-get', ['install', '-y', '-qq', '--no-install-recommends', 'nginx-light'], { stdio: 'inherit', env });
  if (hasNginx()) return true;
  console.log('[bench] nginx could not be installed: app figures only.');
  return false;
}

async function measure(label: string, url: string) {
  const run = (duration: number) =>
    autocannon({ url, connections, duration, pipelining: 1, headers: { 'accept-encoding': 'gzip' } });
  await run(2); // warm-up, not counted
  const result = await run(durationSeconds);
  const errors = result.errors + result.non2xx + result.timeouts;
  console.log(
    `${label.padEnd(6)} ${result.requests.average.toFixed(0).padStart(8)} req/s   p99 ${String(result.latency.p99).padStart(4)} ms   ` +
      `p50 ${String(result.latency.p50).padStart(4)} ms   ${errors} errors`,
  );
  return { rps: result.requests.average, p99: result.latency.p99 };
}

const children: ChildProcess[] = [];
const workDir = mkdtempSync(join(tmpdir(), 'benchwire-bench-public-'));
// nginx started as root serves with an unprivileged worker: the page files must be readable by it.
chmodSync(workDir, 0o755);
let databaseUrl: string | null = null;
let stopDatabase: (() => Promise<void>) | null = null;

async function cleanUp() {
  for (const child of children) if (child.exitCode === null) child.kill('SIGTERM');
  if (databaseUrl) {
    spawnSync(process.execPath, ['--import', 'tsx', 'server/cli/setup-database.ts', '--drop'], {
      cwd: projectRoot,
      env: { ...process.env, DATABASE_URL: databaseUrl },
      stdio: 'ignore',
    });
  }
  await stopDatabase?.();
  rmSync(workDir, { recursive: true, force: true });
}

try {
  console.log(`[bench] ${availableParallelism()} CPU(s), load average ${loadavg()[0].toFixed(2)}`);
  const database = (await ensureDatabase()) as { url: string; startedHere: boolean; stop: () => Promise<void> };
  if (database.startedHere) stopDatabase = database.stop;
  const url = new URL(database.url);
  url.pathname = `/benchwire_bench_public_${process.pid}`;
  databaseUrl = url.toString();
  const setUp = spawnSync(
    process.execPath,
    ['--import', 'tsx', 'server/cli/setup-database.ts', '--fresh', '--seed', '--quiet'],
    { cwd: projectRoot, env: { ...process.env, DATABASE_URL: databaseUrl }, stdio: 'inherit' },
  );
  if (setUp.status !== 0) throw new Error('could not set up the benchmark database');

  const db = await createConnection(databaseUrl);
  const [rows] = await db.query(
    "SELECT path FROM published_pages WHERE roundup_id IS NOT NULL AND variant = '' ORDER BY LENGTH(body) DESC LIMIT 1",
  );
  await db.end();
  const path = (rows as { path: string }[])[0]?.path;
  if (!path) throw new Error('the demo seed published no roundup');

  const appPort = await freePort();
  const app = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: projectRoot,
    env: {
      ...process.env,
      DATABASE_URL: databaseUrl,
      PORT: String(appPort),
      HOST: '127.0.0.1',
      NODE_ENV: 'production',
      JOB_RUNNER: 'off',
      COOKIE_SECURE: 'false',
    },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  children.push(app);
  const appUrl = `http://127.0.0.1:${appPort}${path}`;
  await waitFor(appUrl, app, 'the app');

  const identity = await fetchRaw(appUrl, 'identity');
  const gzipped = await fetchRaw(appUrl, 'gzip');
  if (gzipped.headers['content-encoding'] !== 'gzip') throw new Error('the app did not answer with gzip');
  console.log(
    `[bench] ${path}: ${identity.body.length} bytes, ${gzipped.body.length} gzipped; ${connections} connections, ${durationSeconds} s each`,
  );

  let nginxUrl: string | null = null;
  if (ensureNginx()) {
    const nginxPort = await freePort();
    const root = join(workDir, 'root');
    mkdirSync(root, { recursive: true });
    for (const dir of ['logs', 'temp']) mkdirSync(join(workDir, dir), { recursive: true });
    writeFileSync(join(root, 'page.html'), identity.body);
    writeFileSync(join(root, 'page.html.gz'), gzipped.body);
    const conf = join(workDir, 'nginx.conf');
    writeFileSync(
      conf,
      `worker_processes 1;
daemon off;
pid ${join(workDir, 'nginx.pid')};
error_log stderr warn;
events { worker_connections 4096; }
http {
  access_log off;
  sendfile on;
  tcp_nopush on;
  keepalive_requests 1000000;
  client_body_temp_path ${join(workDir, 'temp')};
  proxy_temp_path ${join(workDir, 'temp')};
  fastcgi_temp_path ${join(workDir, 'temp')};
  uwsgi_temp_path ${join(workDir, 'temp')};
  scgi_temp_path ${join(workDir, 'temp')};
  server {
    listen 127.0.0.1:${nginxPort};
    location = ${path} {
      alias ${join(root, 'page.html')};
      default_type "text/html; charset=utf-8";
      gzip_static on;
      gzip_vary on;
      add_header Cache-Control "public, max-age=60, must-revalidate";
    }
  }
}
`,
    );
    const nginx = spawn('nginx', ['-p', workDir, '-c', conf, '-e', 'stderr'], {
      stdio: ['ignore', 'ignore', 'inherit'],
    });
    children.push(nginx);
    nginxUrl = `http://127.0.0.1:${nginxPort}${path}`;
    await waitFor(nginxUrl, nginx, 'nginx');
    const same = await fetchRaw(nginxUrl, 'gzip');
    if (same.headers['content-encoding'] !== 'gzip' || !same.body.equals(gzipped.body)) {
      throw new Error('nginx does not serve the same gzip bytes as the app');
    }
    console.log('[bench] nginx serves the same gzip bytes (checked)');
  }

  const appResult = await measure('app', appUrl);
  if (nginxUrl) {
    const nginxResult = await measure('nginx', nginxUrl);
    const ratio = appResult.rps / nginxResult.rps;
    console.log(
      `\napp / nginx: ${ratio.toFixed(2)}× requests/s (target ≥ 0.70×) — ${ratio >= 0.7 ? 'met' : 'NOT met'}; ` +
        `app p99 ${appResult.p99} ms (target < 20 ms) — ${appResult.p99 < 20 ? 'met' : 'NOT met'}`,
    );
  } else {
    console.log(
      `\napp p99 ${appResult.p99} ms (target < 20 ms) — ${appResult.p99 < 20 ? 'met' : 'NOT met'}; no nginx baseline`,
    );
  }
  const [one, five] = loadavg();
  console.log(`[bench] load average at the end: ${one.toFixed(2)} (1 min), ${five.toFixed(2)} (5 min)`);
} catch (error) {
  console.error(`[bench] ${(error as Error).message}`);
  process.exitCode = 1;
} finally {
  await cleanUp();
}
