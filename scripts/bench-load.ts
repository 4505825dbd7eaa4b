/**
 * Load benchmark of the whole product (issue 14): for 60 s (`-- --seconds N` for another length) 200 readers open
 * published pages (home, results pages, board pages, the compare form: all served from memory) while editors and testers work through the API (lists, a roundup and its matrix, the dashboard,
 * new catalog products, logger files checked), all against one app server process on 127.0.0.1 with the demo
 * outlet seeded. In the same run nginx (Debian's nginx-light) serves the very same reader-page bytes to 200
 * readers as the static-file baseline. Prints requests, p50 and p99 per kind and the server's memory before and
 * after. Passes (exit 0) with zero errors (non-2xx, socket errors, timeouts) and memory growth within the bound.
 *
 * Staff are paced like people at work (each connection a request or two a second); each reader opens a page a
 * second (`-- --reader-rate 0` sends as fast as the server answers), and the nginx baseline gets the same pace.
 */
import type { ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { availableParallelism, loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import autocannon from 'autocannon';
import { syntheticLoggerLog } from '../shared/generators/synthetic-logger-log';
import {
  ownDatabase,
  queryDatabase,
  setUpDatabase,
  siteHeaders,
  sleep,
  startDemoOutlet,
  storedReaderPages,
  type AppProcess,
} from './lib/app-process';
import { ensureNginx, fetchRaw, startStaticBaseline } from './lib/static-baseline';
import { productRequest } from '../tests/support/plan-requests';

const secondsArg = process.argv.indexOf('--seconds');
const seconds = Number(secondsArg > 0 ? process.argv[secondsArg + 1] : (process.env.BENCH_SECONDS ?? 60));
const READERS = 200;
/** Each reader opens a page this many times a second (`-- --reader-rate N`; 0 = as fast as the server answers). */
const rateArg = process.argv.indexOf('--reader-rate');
const READER_RATE = Number(rateArg > 0 ? process.argv[rateArg + 1] : 1);
const readerPace = READER_RATE > 0 ? { connectionRate: READER_RATE } : {};
/** Resident memory of the server may grow by at most this much over the run (caches fill, the heap settles). */
const MEMORY_GROWTH_BOUND_MIB = 150;

type Request = autocannon.Request & { headers?: Record<string, string> };
type Result = autocannon.Result;

function cannon(url: string, connections: number, requests: Request[], extra: Partial<autocannon.Options> = {}) {
  return autocannon({ url, connections, duration: seconds, pipelining: 1, timeout: 10, requests, ...extra });
}

// autocannon counts timeouts among `errors` (connection errors, timeouts included).
const errorsOf = (r: Result) => r.errors + r.non2xx;

function line(label: string, connections: number, r: Result) {
  return (
    `${label.padEnd(26)} ${String(connections).padStart(5)} ${String(r.requests.total).padStart(9)} ` +
    `${r.requests.average.toFixed(0).padStart(7)} ${String(r.latency.p50).padStart(6)} ${String(r.latency.p99).padStart(6)} ` +
    `${String(errorsOf(r)).padStart(7)}`
  );
}

const children: ChildProcess[] = [];
const workDir = mkdtempSync(join(tmpdir(), 'benchwire-bench-load-'));
let app: AppProcess | null = null;
let databaseUrl: string | null = null;
let stopDatabase: (() => Promise<void>) | null = null;

try {
  console.log(
    `[load] ${availableParallelism()} CPU(s), load average ${loadavg()[0].toFixed(2)}; ${seconds} s per run; ` +
      `readers ${READER_RATE > 0 ? `${READER_RATE} page(s)/s each` : 'unpaced'}`,
  );
  const database = await ownDatabase(`benchwire_bench_load_${process.pid}`);
  stopDatabase = database.stop;
  databaseUrl = database.url;
  const outlet = await startDemoOutlet(databaseUrl, {
    fresh: true,
    env: { JOB_RUNNER: 'on', UPLOADS_DIR: join(workDir, 'uploads') },
    staff: ['editor', 'tester'],
  });
  app = outlet.app;
  const base = app.baseUrl;
  const { editor, tester } = outlet.cookies;

  // Reader pages: every page publishing stored (home, results pages, board pages, the compare form), served from
  // memory. The board pages the results pages link to must be among them.
  const readerPaths = await storedReaderPages(databaseUrl, 'all');
  const pages = new Map<string, { identity: Buffer; gzip: Buffer }>();
  for (const path of readerPaths) {
    const identity = await fetchRaw(`${base}${path}`, 'identity');
    const gzip = await fetchRaw(`${base}${path}`, 'gzip');
    if (identity.status !== 200 || gzip.status !== 200) throw new Error(`${path} answered ${identity.status}`);
    pages.set(path, { identity: identity.body, gzip: gzip.body });
  }
  const boards = readerPaths.filter((path) => path.startsWith('/read/products/'));
  if (boards.length === 0) throw new Error('no board page is stored: publishing did not render them');
  console.log(
    `[load] ${pages.size} published pages, ${boards.length} of them board pages: ${[...pages.keys()].join(', ')}`,
  );

  const [roundup] = await queryDatabase<{ id: number }>(databaseUrl, 'SELECT id FROM roundups ORDER BY id LIMIT 1');
  const get = (path: string, cookie: string): Request => ({ method: 'GET', path, headers: siteHeaders(base, cookie) });
  const editorReads = [
    get('/api/dashboard', editor),
    get('/api/roundups', editor),
    get(`/api/roundups/${roundup.id}`, editor),
    get(`/api/roundups/${roundup.id}/matrix`, editor),
    get('/api/catalog/products?limit=25', editor),
  ];
  const testerReads = [
    get('/api/my-bench', tester),
    get(`/api/roundups/${roundup.id}/matrix`, tester),
    get('/api/benches', tester),
    get('/api/catalog/products?limit=25', tester),
  ];
  for (const request of [...editorReads, ...testerReads]) {
    const response = await fetch(`${base}${request.path}`, { headers: request.headers });
    if (response.status !== 200) throw new Error(`${request.path} answered ${response.status}`);
  }
  let serial = 0;
  const productWrite: Request = {
    method: 'POST',
    path: '/api/catalog/products',
    headers: siteHeaders(base, editor),
    setupRequest: (request) => ({
      ...request,
      body: JSON.stringify(productRequest('Korvath', `HX4 Load ${process.pid}-${++serial}`, 'Helix-1700')),
    }),
  };
  const boundary = 'benchwireloadboundary';
  const log = syntheticLoggerLog({
    durationS: 900,
    sampleHz: 1,
    seed: 3,
    probes: [{ name: 'VRM 1', startC: 21, riseC: 45, tauS: 300, noiseC: 0.05 }],
    ambient: { name: 'Ambient', startC: 21, noiseC: 0.05 },
  });
  const logCheck: Request = {
    method: 'POST',
    path: '/api/log-check/analyse',
    headers: { ...siteHeaders(base, tester), 'content-type': `multipart/form-data; boundary=${boundary}` },
    body: Buffer.from(
      `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="soak.csv"\r\nContent-Type: text/csv\r\n\r\n` +
        `${log}\r\n--${boundary}\r\nContent-Disposition: form-data; name="request"\r\n\r\n` +
        `${JSON.stringify({ mapping: { time: 'Time [s]', vrm: ['VRM 1 [°C]'], ambient: 'Ambient [°C]' } })}\r\n--${boundary}--\r\n`,
    ),
  };
  const checked = await fetch(`${base}${logCheck.path}`, {
    method: 'POST',
    headers: logCheck.headers,
    body: new Uint8Array(logCheck.body as Buffer),
  });
  if (checked.status !== 200) throw new Error(`the log check answered ${checked.status}: ${await checked.text()}`);

  const readerRequests: Request[] = [...pages.keys()].map((path) => ({
    method: 'GET',
    path,
    headers: { 'accept-encoding': 'gzip' },
  }));
  const staff = { editorReads: 10, testerReads: 10, writes: 4, checks: 4 };
  const everyone = (duration: number) =>
    Promise.all([
      cannon(base, READERS, readerRequests, { ...readerPace, duration }),
      cannon(base, staff.editorReads, editorReads, { connectionRate: 2, duration }),
      cannon(base, staff.testerReads, testerReads, { connectionRate: 2, duration }),
      cannon(base, staff.writes, [productWrite], { connectionRate: 1, duration }),
      cannon(base, staff.checks, [logCheck], { connectionRate: 1, duration }),
    ]);
  // Warm-up with the whole mix, not counted: the worker threads, connection pool and caches fill before "before".
  await everyone(10);
  await sleep(2_000);
  const rssBefore = app.rssMiB();
  const loadBefore = loadavg()[0];

  const [readers, editorsReading, testersReading, editorsWriting, testersChecking] = await everyone(seconds);
  // The one-minute load average as the run ends: how busy the machine was (other work on it skews every figure).
  const loadDuring = loadavg()[0];
  await sleep(5_000);
  const rssAfter = app.rssMiB();
  const written = await queryDatabase<{ n: number }>(
    databaseUrl,
    "SELECT COUNT(*) AS n FROM products WHERE model LIKE 'HX4 Load %'",
  );

  // The baseline: nginx serves the same bytes (identity and gzip) of every reader page, in this run.
  let baseline: Result | null = null;
  if (ensureNginx((text) => console.log(`[load] ${text}`))) {
    const nginx = await startStaticBaseline(workDir, pages);
    children.push(nginx.child);
    console.log('[load] nginx serves the same gzip bytes for every reader page (checked)');
    baseline = await cannon(nginx.url, READERS, readerRequests, readerPace);
  }

  console.log(`\nkind                       conns  requests   req/s  p50 ms p99 ms  errors`);
  console.log(line('reader pages (app)', READERS, readers));
  console.log(line('API reads, editors', staff.editorReads, editorsReading));
  console.log(line('API reads, testers', staff.testerReads, testersReading));
  console.log(line('API writes, new products', staff.writes, editorsWriting));
  console.log(line('log checks (upload)', staff.checks, testersChecking));
  if (baseline) console.log(line('reader pages (nginx)', READERS, baseline));
  // What the errors were: statuses other than 2xx, and requests without an answer in autocannon's 10 s.
  const kinds = { readers, editorsReading, testersReading, editorsWriting, testersChecking };
  for (const [kind, r] of Object.entries(kinds)) {
    if (errorsOf(r) === 0) continue;
    const statuses = Object.entries(r.statusCodeStats ?? {})
      .filter(([code]) => !code.startsWith('2'))
      .map(([code, stat]) => `${stat.count} × ${code}`);
    console.log(
      `  ${kind}: ${[...statuses, `${r.timeouts} timed out`, `${r.errors - r.timeouts} socket errors`].join(', ')}`,
    );
  }
  const apiReads = [editorsReading, testersReading];
  const apiP99 = Math.max(...apiReads.map((r) => r.latency.p99));
  // Staff connections ask at a fixed pace: what the server kept up with, against what was asked.
  const apiReadRate = apiReads.reduce((sum, r) => sum + r.requests.total, 0) / seconds;
  const apiReadAsked = (staff.editorReads + staff.testerReads) * 2;
  const totalErrors = [readers, editorsReading, testersReading, editorsWriting, testersChecking].reduce(
    (sum, r) => sum + errorsOf(r),
    0,
  );
  const growth = rssAfter - rssBefore;
  console.log(
    `\nreader pages p99 ${readers.latency.p99} ms${baseline ? ` (static baseline ${baseline.latency.p99} ms)` : ''}; ` +
      `API reads p99 ${apiP99} ms at ${apiReadRate.toFixed(1)} req/s (${apiReadAsked} asked); API writes p99 ` +
      `${editorsWriting.latency.p99} ms; ${editorsWriting['2xx']} products created, ${written[0].n} in the database\n` +
      `load average (1 min) ${loadBefore.toFixed(2)} as the run started, ${loadDuring.toFixed(2)} as it ended ` +
      `(${availableParallelism()} CPUs)\n` +
      `errors: ${totalErrors}\n` +
      `server memory (RSS): ${rssBefore.toFixed(0)} MiB before, ${rssAfter.toFixed(0)} MiB after ` +
      `(+${growth.toFixed(0)} MiB; bound ${MEMORY_GROWTH_BOUND_MIB} MiB) — ${growth <= MEMORY_GROWTH_BOUND_MIB ? 'within' : 'OVER'}`,
  );
  // Every write answered 201 is stored; a few more may be, answered after autocannon stopped counting.
  const passed =
    totalErrors === 0 && growth <= MEMORY_GROWTH_BOUND_MIB && Number(written[0].n) >= editorsWriting['2xx'];
  console.log(`\n[load] ${passed ? 'PASSED' : 'FAILED'}`);
  if (!passed) process.exitCode = 1;
} catch (error) {
  console.error(`[load] ${(error as Error).stack ?? error}`);
  process.exitCode = 1;
} finally {
  for (const child of children) if (child.exitCode === null) child.kill('SIGTERM');
  await app?.stop();
  if (databaseUrl) setUpDatabase(databaseUrl, ['--drop']);
  await stopDatabase?.();
  rmSync(workDir, { recursive: true, force: true });
}
