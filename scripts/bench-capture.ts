/**
 * Benchmark of bench capture (issue 8): a one-hour log at 10 Hz with eight channels (36,000 rows) sent to the real
 * server (createApp on a throwaway MariaDB database, files on local disk in a temporary folder) in two ways, in
 * alternating blocks of one run:
 *   - analysed alone: POST /api/log-check/analyse — upload, worker-pool analysis, answer; nothing kept (the baseline);
 *   - stored: POST /api/cells/:cellId/runs — the same upload and analysis, plus the SHA-256, the same-file check, the
 *     file written to storage and the run, its analysis and audit rows written in one transaction.
 * Target: storing answers within 2× of analysing alone (medians).
 *
 * Then memory: the server's heap after a full collection, before and after 20 more stored runs of such a log.
 * Target: it returns to its baseline (within 8 MB: a few cached statements and pooled connections may stay).
 *
 * Needs a MariaDB server: DATABASE_URL, or the private one `npm start` uses. The database is created and dropped here.
 */
import { spawnSync } from 'node:child_process';
import { mkdtemp, rm } from 'node:fs/promises';
import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import { availableParallelism, loadavg, tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { setFlagsFromString } from 'node:v8';
import { runInNewContext } from 'node:vm';
import { createApp } from '../server/app';
import { createServices } from '../server/compose-services';
import { hashPassword } from '../server/auth/passwords';
import { createDataSource, initializeDataSource } from '../server/data-source';
import { UserEntity } from '../server/entities/user.entity';
import { loadEnv } from '../server/env';
import { benchSoakLog, benchSoakMapping, median } from './lib/soak-log';
import { planAssignedCell } from '../tests/support/plan-requests';

setFlagsFromString('--expose-gc');
const collectGarbage = runInNewContext('gc') as () => void;

const projectRoot = resolve(import.meta.dirname, '..');
const timedPerSide = 9;
const settlingPerSide = 2;
const memoryUploads = 20;
const memoryToleranceBytes = 8 * 1024 * 1024;

interface DatabaseHandle {
  url: string;
  stop: () => Promise<void>;
}
type Setup = { ensureDatabase: () => Promise<DatabaseHandle> };
// The orchestration helpers are plain ES modules shared with `npm start` and `npm test`.
const setupModule: string = './lib/setup.mjs';
const { ensureDatabase } = (await import(setupModule)) as Setup;

const server = await ensureDatabase();
const databaseUrl = (() => {
  const url = new URL(server.url);
  url.pathname = `/benchwire_test_bench_capture_${process.pid}`;
  return url.toString();
})();
const setupDatabase = (flag: '--fresh' | '--drop') => {
  const result = spawnSync(
    resolve(projectRoot, 'node_modules', '.bin', 'tsx'),
    ['server/cli/setup-database.ts', flag, '--quiet'],
    { cwd: projectRoot, stdio: 'inherit', env: { ...process.env, DATABASE_URL: databaseUrl } },
  );
  if (result.status !== 0) throw new Error(`setup-database ${flag} failed`);
};

const uploadsDir = await mkdtemp(join(tmpdir(), 'benchwire-bench-capture-'));
setupDatabase('--fresh');
const env = loadEnv({
  ...process.env,
  NODE_ENV: 'production',
  DATABASE_URL: databaseUrl,
  COOKIE_SECURE: 'false',
  STORAGE_DRIVER: 'local',
  UPLOADS_DIR: uploadsDir,
  JOB_RUNNER: 'off',
});
const dataSource = await initializeDataSource(createDataSource(databaseUrl));
const services = createServices(dataSource, env);
const httpServer = createServer(createApp({ dataSource, env, services }));
await new Promise<void>((done) => httpServer.listen(0, '127.0.0.1', done));
const base = `http://127.0.0.1:${(httpServer.address() as AddressInfo).port}`;

/** A signed-in staff member: every request carries the session cookie and a same-site Origin. */
async function staff(role: 'editor' | 'tester') {
  const email = `bench-${role}-${process.pid}@bench.soaksheet.example`;
  const password = `bench-${role}-password-${process.pid}`;
  const users = dataSource.getRepository(UserEntity);
  const user = await users.save(
    users.create({
      email,
      displayName: `Bench ${role}`,
      role,
      passwordHash: await hashPassword(password),
      active: true,
    }),
  );
  const signIn = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', Origin: base },
    body: JSON.stringify({ email, password }),
  });
  if (!signIn.ok) throw new Error(`sign-in failed: ${await signIn.text()}`);
  const cookie = signIn.headers
    .getSetCookie()
    .map((line) => line.split(';')[0])
    .join('; ');
  const send = async (method: string, path: string, body?: unknown | FormData) => {
    const form = body instanceof FormData;
    const response = await fetch(`${base}${path}`, {
      method,
      headers: { Cookie: cookie, Origin: base, ...(body && !form ? { 'Content-Type': 'application/json' } : {}) },
      body: form ? body : body === undefined ? undefined : JSON.stringify(body),
    });
    const text = await response.text();
    if (!response.ok) throw new Error(`${method} ${path}: ${response.status} ${text}`);
    return (text ? JSON.parse(text) : null) as Record<string, unknown> & { id: number };
  };
  return { id: user.id, send };
}

try {
  const editor = await staff('editor');
  const tester = await staff('tester');
  const { cellId } = await planAssignedCell(editor.send, {
    suffix: `bench ${process.pid}`,
    testerId: tester.id,
    profileName: 'Bench capture profile',
    title: 'Helix-1700 bench capture',
    model: 'Q70 Bench',
  });

  let uploads = 0;
  const analyseAlone = async () => {
    const form = new FormData();
    form.append('request', JSON.stringify({ mapping: benchSoakMapping }));
    form.append('file', new Blob([benchSoakLog(`analyse ${(uploads += 1)}`)]), 'soak.csv');
    const started = performance.now();
    await tester.send('POST', '/api/log-check/analyse', form);
    return performance.now() - started;
  };
  const store = async () => {
    const form = new FormData();
    form.append(
      'request',
      JSON.stringify({
        firmwareVersion: '1.02',
        startedAt: new Date().toISOString(),
        outsideBookingReason: 'Benchmark run on the open bench.',
        mapping: benchSoakMapping,
      }),
    );
    form.append('file', new Blob([benchSoakLog(`store ${(uploads += 1)}`)]), 'soak.csv');
    const started = performance.now();
    await tester.send('POST', `/api/cells/${cellId}/runs`, form);
    return performance.now() - started;
  };

  // Warm both paths (worker threads up, statements prepared), then time them in alternating single runs so a
  // change in the machine's load falls on both sides alike.
  for (let run = 0; run < settlingPerSide; run++) {
    await analyseAlone();
    await store();
  }
  const analyseTimes: number[] = [];
  const storeTimes: number[] = [];
  for (let run = 0; run < timedPerSide; run++) {
    collectGarbage();
    analyseTimes.push(await analyseAlone());
    collectGarbage();
    storeTimes.push(await store());
  }
  const analyseMs = median(analyseTimes);
  const storeMs = median(storeTimes);
  const ratio = storeMs / analyseMs;
  const line = (label: string, value: string) => console.log(`  ${label.padEnd(46)}${value}`);
  const sample = benchSoakLog('size');
  console.log(
    `Benchwire capture benchmark: ${(sample.split('\n').length - 4).toLocaleString('en')} rows × 8 channels, ${(sample.length / 1e6).toFixed(2)} MB per upload, median of ${timedPerSide} runs each`,
  );
  line('analysed alone (POST /api/log-check/analyse)', `${analyseMs.toFixed(0).padStart(7)} ms`);
  line('stored as a run (POST /api/cells/:id/runs)', `${storeMs.toFixed(0).padStart(7)} ms`);
  line('ratio, stored / analysed alone', `${ratio.toFixed(2).padStart(7)}× (target < 2×)`);
  line('load average', `${loadavg()[0].toFixed(1).padStart(7)} on ${availableParallelism()} cores`);
  const fastEnough = ratio < 2;
  console.log(`  ${fastEnough ? 'PASS' : 'FAIL'}: storing a run answers within 2× of analysing the file alone`);

  // Memory: the heap (JS objects) and external memory (Buffers) after a full collection, before and after
  // 20 more stored runs. The resident size is shown too; the allocator keeps freed pages, so it is not the target.
  const settle = async () => {
    for (let round = 0; round < 3; round++) {
      collectGarbage();
      await new Promise((done) => setTimeout(done, 50));
    }
    const usage = process.memoryUsage();
    return { ...usage, held: usage.heapUsed + usage.external };
  };
  const mb = (bytes: number) => `${(bytes / 1024 / 1024).toFixed(1)} MB`;
  const before = await settle();
  for (let run = 0; run < memoryUploads; run++) await store();
  const after = await settle();
  console.log(`\nServer memory after a full collection, before and after ${memoryUploads} more stored runs`);
  line('heap used', `${mb(before.heapUsed).padStart(9)} → ${mb(after.heapUsed)}`);
  line('external (Buffers)', `${mb(before.external).padStart(9)} → ${mb(after.external)}`);
  line('resident set (for reference)', `${mb(before.rss).padStart(9)} → ${mb(after.rss)}`);
  const grown = after.held - before.held;
  const returned = grown < memoryToleranceBytes;
  line('heap + external grew by', `${mb(grown).padStart(9)} (target < ${mb(memoryToleranceBytes)})`);
  console.log(
    `  ${returned ? 'PASS' : 'FAIL'}: the server's memory returns to its baseline after ${memoryUploads} uploads`,
  );
  process.exitCode = fastEnough && returned ? 0 : 1;
} finally {
  httpServer.closeAllConnections();
  await new Promise((done) => httpServer.close(done));
  await services.logFileAnalyser.close().catch(() => undefined);
  await dataSource.destroy();
  setupDatabase('--drop');
  await rm(uploadsDir, { recursive: true, force: true });
  await server.stop();
}
