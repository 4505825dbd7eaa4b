/**
 * Database outage drill (issue 14, fault 3): a private MariaDB of its own (temp folder, free port — never the
 * shared one) is stopped for 10 s while staff read and write through the API and readers open a published page,
 * then started again. The app server runs as its own process and is not restarted. Prints what every request got,
 * the slowest answer, how soon the app answered again, and whether every write answered 201 is in the database.
 *
 *   npm run drill:database [-- --outage <seconds>]
 *
 * Passes (exit 0) when: no request went unanswered or took longer than the bound, every failure was a 503
 * database_unavailable JSON error, the server process is the same one at the end, requests succeed again within
 * 10 s of the database, and no acknowledged write is missing.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import {
  freePort,
  percentile,
  queryDatabase,
  siteHeaders,
  sleep,
  startDemoOutlet,
  storedReaderPages,
  type AppProcess,
} from './lib/app-process';
import { productRequest } from '../tests/support/plan-requests';

const argSeconds = (name: string, fallback: number) => {
  const index = process.argv.indexOf(name);
  return index > 0 ? Number(process.argv[index + 1]) : fallback;
};
const OUTAGE_S = argSeconds('--outage', 10);
const BEFORE_S = 5;
const AFTER_S = 10;
/** No request may take longer: the app bounds a connection attempt at 5 s and the wait for a pooled one at 10 s. */
const REQUEST_BOUND_MS = 15_000;

const workDir = mkdtempSync(join(tmpdir(), 'benchwire-drill-database-'));
process.env.BENCHWIRE_MARIADB_DIR = join(workDir, 'mariadb');
process.env.BENCHWIRE_MARIADB_PORT = String(await freePort());
// Imported after the environment names the private server's folder and port (the module reads them once).
// @ts-expect-error plain ESM helper of the npm scripts, without types
const { startPrivateMariadb } = await import('./lib/mariadb.mjs');

type Outcome = { kind: string; at: number; ms: number; status: number; code?: string; id?: number };

let app: AppProcess | null = null;
let database: { url: string; stop: () => Promise<void> } | null = null;
try {
  const started = Date.now();
  database = await startPrivateMariadb();
  const databaseUrl = database!.url;
  const outlet = await startDemoOutlet(databaseUrl, { env: { JOB_RUNNER: 'on' }, staff: ['editor', 'writer'] });
  app = outlet.app;
  const pid = app.child.pid;
  const base = app.baseUrl;
  const { editor, writer } = outlet.cookies;
  console.log(
    `[drill] private MariaDB on ${new URL(databaseUrl).port}, app pid ${pid}, ready in ${((Date.now() - started) / 1000).toFixed(1)} s`,
  );
  const [pagePath] = await storedReaderPages(databaseUrl, 'results', 1);
  const platform = `Helix-1700 drill ${process.pid}`;

  const t0 = Date.now();
  const end = t0 + (BEFORE_S + OUTAGE_S + AFTER_S) * 1000;
  const outcomes: Outcome[] = [];
  const unanswered: string[] = [];
  let serial = 0;
  const requests = {
    'API read': () =>
      fetch(`${base}/api/catalog/products?limit=10`, {
        headers: siteHeaders(base, writer),
        signal: AbortSignal.timeout(REQUEST_BOUND_MS + 5_000),
      }),
    'API write': () =>
      fetch(`${base}/api/catalog/products`, {
        method: 'POST',
        headers: siteHeaders(base, editor),
        body: JSON.stringify(productRequest('Korvath', `HX4 Drill ${process.pid}-${++serial}`, platform)),
        signal: AbortSignal.timeout(REQUEST_BOUND_MS + 5_000),
      }),
    'reader page': () => fetch(`${base}${pagePath ?? '/'}`, { signal: AbortSignal.timeout(REQUEST_BOUND_MS + 5_000) }),
  };
  async function loop(kind: keyof typeof requests) {
    while (Date.now() < end) {
      const at = Date.now() - t0;
      try {
        const response = await requests[kind]();
        const text = await response.text();
        let body: { id?: number; error?: { code?: string } } = {};
        try {
          body = JSON.parse(text);
        } catch {
          // an HTML page
        }
        outcomes.push({
          kind,
          at,
          ms: Date.now() - t0 - at,
          status: response.status,
          code: body.error?.code,
          id: response.status === 201 ? body.id : undefined,
        });
      } catch (error) {
        unanswered.push(`${kind} at ${at} ms: ${(error as Error).message}`);
      }
      await sleep(20);
    }
  }
  const load = Promise.all([
    ...Array.from({ length: 6 }, () => loop('API read')),
    ...Array.from({ length: 3 }, () => loop('API write')),
    ...Array.from({ length: 3 }, () => loop('reader page')),
  ]);
  await sleep(BEFORE_S * 1000);
  const rssBefore = app.rssMiB();
  await database!.stop();
  const stoppedAt = Date.now() - t0;
  console.log(`[drill] MariaDB stopped at ${(stoppedAt / 1000).toFixed(1)} s`);
  await sleep(OUTAGE_S * 1000);
  database = await startPrivateMariadb();
  const upAt = Date.now() - t0;
  console.log(
    `[drill] MariaDB started again at ${(upAt / 1000).toFixed(1)} s (down ${((upAt - stoppedAt) / 1000).toFixed(1)} s)`,
  );
  await load;

  const sameProcess = app.child.exitCode === null && app.child.pid === pid;
  const during = outcomes.filter((o) => o.at >= stoppedAt && o.at < upAt);
  const failures = outcomes.filter((o) => o.status >= 300);
  const unclear = failures.filter((o) => !(o.status === 503 && o.code === 'database_unavailable'));
  const slowest = Math.max(...outcomes.map((o) => o.ms));
  const firstBack = outcomes
    .filter((o) => o.kind !== 'reader page' && o.at >= upAt && o.status < 300)
    .sort((a, b) => a.at - b.at)[0];
  const acknowledged = outcomes.filter((o) => o.status === 201).map((o) => o.id!);
  const stored = acknowledged.length
    ? await queryDatabase<{ id: number }>(database!.url, 'SELECT id FROM products WHERE id IN (?)', [acknowledged])
    : [];
  const lost = acknowledged.filter((id) => !stored.some((row) => Number(row.id) === id));

  console.log('\nkind          requests   2xx   503 database_unavailable   other   p99 during outage');
  for (const kind of Object.keys(requests)) {
    const mine = outcomes.filter((o) => o.kind === kind);
    const mineDuring = during.filter((o) => o.kind === kind);
    console.log(
      `${kind.padEnd(12)} ${String(mine.length).padStart(9)} ${String(mine.filter((o) => o.status < 300).length).padStart(5)} ` +
        `${String(mine.filter((o) => o.status === 503 && o.code === 'database_unavailable').length).padStart(26)} ` +
        `${String(mine.filter((o) => o.status >= 300 && !(o.status === 503 && o.code === 'database_unavailable')).length).padStart(7)} ` +
        `${String(
          percentile(
            mineDuring.map((o) => o.ms),
            99,
          ),
        ).padStart(16)} ms`,
    );
  }
  const recoveryMs = firstBack ? firstBack.at + firstBack.ms - upAt : null;
  console.log(
    `\nunanswered requests: ${unanswered.length}${unanswered.length ? ` (${unanswered.slice(0, 3).join('; ')})` : ''}\n` +
      `slowest answer: ${slowest} ms (bound ${REQUEST_BOUND_MS} ms)\n` +
      `other errors than 503 database_unavailable: ${unclear.length}${
        unclear.length
          ? ` (${unclear
              .slice(0, 3)
              .map((o) => `${o.kind} ${o.status} ${o.code}`)
              .join('; ')})`
          : ''
      }\n` +
      `server process: ${sameProcess ? `the same (pid ${pid}), never restarted` : 'EXITED'}; memory ${rssBefore.toFixed(0)} → ${app.rssMiB().toFixed(0)} MiB\n` +
      `API answered again ${recoveryMs === null ? 'NEVER' : `${recoveryMs} ms`} after MariaDB was up\n` +
      `acknowledged writes: ${acknowledged.length}, in the database afterwards: ${acknowledged.length - lost.length}, lost: ${lost.length}`,
  );
  const passed =
    unanswered.length === 0 &&
    slowest <= REQUEST_BOUND_MS &&
    unclear.length === 0 &&
    sameProcess &&
    recoveryMs !== null &&
    recoveryMs < 10_000 &&
    lost.length === 0 &&
    during.some((o) => o.status === 503);
  console.log(`\n[drill] ${passed ? 'PASSED' : 'FAILED'}`);
  if (!passed) process.exitCode = 1;
} catch (error) {
  console.error(`[drill] ${(error as Error).stack ?? error}`);
  process.exitCode = 1;
} finally {
  await app?.stop();
  await database?.stop();
  rmSync(workDir, { recursive: true, force: true });
}
