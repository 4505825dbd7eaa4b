// Helpers of the drill and load scripts: free ports, the app as its own process on the seeded demo outlet, signed-in
// staff, the stored reader pages and a query straight to MariaDB. Figures these scripts print come from the real server process on 127.0.0.1.
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { createServer } from 'node:net';
import { resolve } from 'node:path';
import { createConnection } from 'mysql2/promise';

// Not imported from ./setup.mjs: that loads ./mariadb.mjs, which reads BENCHWIRE_MARIADB_DIR and _PORT once, and
// the drill sets them first.
export const projectRoot = resolve(import.meta.dirname, '..', '..');

export function freePort(): Promise<number> {
  return new Promise((resolvePort, reject) => {
    const server = createServer();
    server.on('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      server.close(() => resolvePort(typeof address === 'object' && address ? address.port : 0));
    });
  });
}

export const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/** Runs `server/cli/setup-database.ts` with the flags on the database the URL names. */
export function setUpDatabase(databaseUrl: string, flags: string[]) {
  const result = spawnSync(process.execPath, ['--import', 'tsx', 'server/cli/setup-database.ts', ...flags], {
    cwd: projectRoot,
    env: { ...process.env, DATABASE_URL: databaseUrl },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  if (result.status !== 0) throw new Error(`setup-database ${flags.join(' ')} failed`);
}

export interface AppProcess {
  child: ChildProcess;
  baseUrl: string;
  /** Resident memory of the server process in MiB, from /proc (Linux). */
  rssMiB(): number;
  stop(): Promise<void>;
}

/** Starts `server/index.ts` as its own Node.js process on a free port and waits until it answers. */
export async function startApp(databaseUrl: string, env: Record<string, string> = {}): Promise<AppProcess> {
  const port = await freePort();
  // BENCHWIRE_APP_NODE_ARGS adds Node.js flags to the server process alone, e.g. `--cpu-prof --cpu-prof-dir=/tmp/p`
  // to see where its time goes during a run.
  const nodeArgs = (process.env.BENCHWIRE_APP_NODE_ARGS ?? '').split(' ').filter(Boolean);
  const child = spawn(process.execPath, [...nodeArgs, '--import', 'tsx', 'server/index.ts'], {
    cwd: projectRoot,
    env: {
      ...process.env,
      DATABASE_URL: databaseUrl,
      PORT: String(port),
      HOST: '127.0.0.1',
      NODE_ENV: 'production',
      COOKIE_SECURE: 'false',
      // Staff sign in many times from 127.0.0.1 in these runs.
      SIGN_IN_LIMIT_PER_IP: '100000',
      ...env,
    },
    stdio: ['ignore', 'ignore', 'pipe'],
  });
  let stderr = '';
  child.stderr?.on('data', (chunk: Buffer) => {
    stderr = (stderr + chunk.toString()).slice(-20_000);
  });
  const baseUrl = `http://127.0.0.1:${port}`;
  const deadline = Date.now() + 120_000;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`the app exited with ${child.exitCode}:\n${stderr}`);
    const up = await fetch(`${baseUrl}/api/health`).then(
      (r) => r.status === 200,
      () => false,
    );
    if (up) break;
    if (Date.now() > deadline) throw new Error('the app did not answer within two minutes');
    await sleep(250);
  }
  return {
    child,
    baseUrl,
    rssMiB() {
      const status = readFileSync(`/proc/${child.pid}/status`, 'utf8');
      return Number(/VmRSS:\s+(\d+)/.exec(status)?.[1] ?? 0) / 1024;
    },
    async stop() {
      if (child.exitCode !== null) return;
      const exited = new Promise((resolve) => child.once('exit', resolve));
      child.kill('SIGTERM');
      await Promise.race([exited, sleep(10_000)]);
      if (child.exitCode === null) child.kill('SIGKILL');
    },
  };
}

/** Headers of a same-site request, as a Benchwire page sends them (the Origin check refuses others). */
export function siteHeaders(baseUrl: string, cookie?: string): Record<string, string> {
  return { origin: baseUrl, 'content-type': 'application/json', ...(cookie ? { cookie } : {}) };
}

/** Signs a demo account in and returns its session cookie (`name=value`). */
export async function signIn(baseUrl: string, email: string, password: string): Promise<string> {
  const response = await fetch(`${baseUrl}/api/auth/sign-in`, {
    method: 'POST',
    headers: siteHeaders(baseUrl),
    body: JSON.stringify({ email, password }),
  });
  if (response.status !== 200)
    throw new Error(`sign-in of ${email} failed: ${response.status} ${await response.text()}`);
  const cookie = response.headers.get('set-cookie') ?? '';
  return cookie.split(';')[0];
}

/** The demo outlet's staff accounts (server/seed), by role. */
export const demoStaff = {
  editor: { email: 'editor@soaksheet.example', password: 'demo-editor-pass' },
  tester: { email: 'tester@soaksheet.example', password: 'demo-tester-pass' },
  writer: { email: 'writer@soaksheet.example', password: 'demo-writer-pass' },
} as const;
export type DemoRole = keyof typeof demoStaff;

export interface DemoOutlet {
  app: AppProcess;
  baseUrl: string;
  /** The session cookie (`name=value`) of each staff member signed in. */
  cookies: Record<DemoRole, string>;
}

/**
 * The demo outlet as the drill and load scripts use it: seeded into the database the URL names (`fresh` drops what is
 * there first), the app server started on it as its own process, and the named staff signed in. The caller stops the
 * app (`app.stop()`) and drops or stops the database.
 */
export async function startDemoOutlet(
  databaseUrl: string,
  options: { fresh?: boolean; env?: Record<string, string>; staff: DemoRole[] },
): Promise<DemoOutlet> {
  setUpDatabase(databaseUrl, [...(options.fresh ? ['--fresh'] : []), '--seed', '--quiet']);
  const app = await startApp(databaseUrl, options.env);
  const cookies = {} as Record<DemoRole, string>;
  try {
    for (const role of options.staff) {
      cookies[role] = await signIn(app.baseUrl, demoStaff[role].email, demoStaff[role].password);
    }
  } catch (error) {
    await app.stop();
    throw error;
  }
  return { app, baseUrl: app.baseUrl, cookies };
}

/**
 * Addresses of the reader pages publishing stored (served from memory), as every reader gets them (no unit variant):
 * `results` keeps only roundups' results pages; `all` adds the home page, board pages and the compare form.
 */
export async function storedReaderPages(databaseUrl: string, which: 'results' | 'all', limit = 30): Promise<string[]> {
  const rows = await queryDatabase<{ path: string }>(
    databaseUrl,
    `SELECT path FROM published_pages WHERE variant = '' AND content_type LIKE 'text/html%'
       ${which === 'results' ? 'AND roundup_id IS NOT NULL' : ''} ORDER BY path LIMIT ?`,
    [limit],
  );
  return rows.map((row) => row.path);
}

/** One query straight to MariaDB (not through the app). */
export async function queryDatabase<T>(databaseUrl: string, sql: string, values: unknown[] = []): Promise<T[]> {
  const connection = await createConnection(databaseUrl);
  try {
    const [rows] = await connection.query(sql, values);
    return rows as T[];
  } finally {
    await connection.end();
  }
}

/** The p-th percentile (0–100) of the values, nearest rank. */
export function percentile(values: number[], p: number): number {
  if (values.length === 0) return 0;
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))];
}

/**
 * A database of the script's own, `name`, on the server `npm test` uses (started here when DATABASE_URL names none):
 * its URL, and how to stop the server when it was started here.
 */
export async function ownDatabase(name: string): Promise<{ url: string; stop: (() => Promise<void>) | null }> {
  // @ts-expect-error plain ESM helper of the npm scripts, without types
  const { ensureDatabase } = await import('./setup.mjs');
  const database = (await ensureDatabase()) as { url: string; startedHere: boolean; stop: () => Promise<void> };
  const url = new URL(database.url);
  url.pathname = `/${name}`;
  return { url: url.toString(), stop: database.startedHere ? database.stop : null };
}

/**
 * A fresh database name, `prefix` with the process id and a random tag, on the MariaDB server DATABASE_URL names;
 * without DATABASE_URL the script stops, saying that `what` makes and drops a database of its own.
 */
export function scratchDatabaseUrl(prefix: string, what: string): URL {
  const base = process.env.DATABASE_URL;
  if (!base) {
    console.error(`Set DATABASE_URL to a MariaDB server (${what} makes and drops a database of its own).`);
    process.exit(1);
  }
  const url = new URL(base);
  url.pathname = `/${prefix}_${process.pid}_${randomBytes(2).toString('hex')}`;
  return url;
}
