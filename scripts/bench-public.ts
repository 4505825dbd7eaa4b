/**
 * Benchmark of the published reader pages (issue 10): autocannon on 127.0.0.1 against a published demo roundup page
 * served by the app, and in the same run the same bytes with the same compression (gzip, as both answer
 * `Accept-Encoding: gzip`) served by nginx from Debian as the baseline. Prints requests/s and p99 latency for both
 * and their ratio. Target: at least 0.7× nginx, and p99 under 20 ms, at 64 connections.
 *
 * Both servers get one process (nginx: worker_processes 1; the app: one Node.js process); autocannon runs here.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { availableParallelism, loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import autocannon from 'autocannon';
import { ownDatabase, queryDatabase, setUpDatabase, startApp, type AppProcess } from './lib/app-process';
import { ensureNginx, fetchRaw, startStaticBaseline } from './lib/static-baseline';

const connections = 64;
const durationSeconds = Number(process.env.BENCH_SECONDS ?? 10);

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

const workDir = mkdtempSync(join(tmpdir(), 'benchwire-bench-public-'));
let app: AppProcess | null = null;
let nginx: Awaited<ReturnType<typeof startStaticBaseline>> | null = null;
let databaseUrl: string | null = null;
let stopDatabase: (() => Promise<void>) | null = null;

async function cleanUp() {
  if (nginx?.child.exitCode === null) nginx.child.kill('SIGTERM');
  await app?.stop();
  if (databaseUrl) setUpDatabase(databaseUrl, ['--drop']);
  await stopDatabase?.();
  rmSync(workDir, { recursive: true, force: true });
}

try {
  console.log(`[bench] ${availableParallelism()} CPU(s), load average ${loadavg()[0].toFixed(2)}`);
  const database = await ownDatabase(`benchwire_bench_public_${process.pid}`);
  stopDatabase = database.stop;
  databaseUrl = database.url;
  setUpDatabase(databaseUrl, ['--fresh', '--seed', '--quiet']);

  const [row] = await queryDatabase<{ path: string }>(
    databaseUrl,
    "SELECT path FROM published_pages WHERE roundup_id IS NOT NULL AND variant = '' ORDER BY LENGTH(body) DESC LIMIT 1",
  );
  const path = row?.path;
  if (!path) throw new Error('the demo seed published no roundup');

  app = await startApp(databaseUrl, { JOB_RUNNER: 'off' });
  const appUrl = `${app.baseUrl}${path}`;

  const identity = await fetchRaw(appUrl, 'identity');
  const gzipped = await fetchRaw(appUrl, 'gzip');
  if (gzipped.headers['content-encoding'] !== 'gzip') throw new Error('the app did not answer with gzip');
  console.log(
    `[bench] ${path}: ${identity.body.length} bytes, ${gzipped.body.length} gzipped; ${connections} connections, ${durationSeconds} s each`,
  );

  let nginxUrl: string | null = null;
  if (ensureNginx((text) => console.log(`[bench] ${text}`))) {
    nginx = await startStaticBaseline(workDir, new Map([[path, { identity: identity.body, gzip: gzipped.body }]]));
    nginxUrl = `${nginx.url}${path}`;
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
