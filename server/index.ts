import { existsSync } from 'node:fs';
import { createServer } from 'node:http';
import { join, resolve } from 'node:path';
import { createApp } from './app';
import { createServices } from './compose-services';
import { createDataSource, initializeDataSource } from './data-source';
import { loadEnv } from './env';
import { createJobRegistry } from './jobs/all';
import { JobRunner } from './jobs/job-runner';
import { MailWorker } from './mail/mail-worker';

const env = loadEnv();
const dataSource = await initializeDataSource(
  createDataSource(env.DATABASE_URL, { logging: env.DB_LOGGING, poolSize: env.DB_POOL_SIZE }),
);
const services = createServices(dataSource, env);
// The built client is dist/client: beside dist/server when this is the built server, under the project root
// when it runs from source.
const clientDir = [
  resolve(import.meta.dirname, '..', 'client'),
  resolve(import.meta.dirname, '..', 'dist', 'client'),
].find((dir) => existsSync(join(dir, 'index.html')));
const app = createApp({
  dataSource,
  env,
  services,
  clientDir: env.NODE_ENV === 'production' ? clientDir : undefined,
});

// The outbox sender and the staff reminder scan (at most every five minutes) run in the server process.
let lastReminderScan = 0;
const mailWorker = new MailWorker(services.mailSender, [
  async () => {
    if (Date.now() - lastReminderScan < 300_000) return;
    lastReminderScan = Date.now();
    await services.staffMail.scanReminders();
  },
]);
if (env.JOB_RUNNER === 'on') mailWorker.start();

// Published reader pages are answered from memory before Express sees the request (the lean path); everything
// else goes to the app. The pages are loaded before the first request and follow publications by any process.
// Stored pages name the reader's stylesheet and script by their build hashes: after a new build they are rendered
// again from their frozen models, so no published page points at a file that is gone (only changed pages are stored).
if (env.NODE_ENV === 'production' && clientDir) {
  await services.publishing.rerenderAll().catch((error: unknown) => {
    console.error('[publishing] could not render the published pages again at start:', error);
  });
}
await services.publishedPages.ensureLoaded();
services.publishedPages.watch();
const server = createServer((req, res) => {
  if (!services.publishedPages.serve(req, res)) app(req, res);
});
server.listen(env.PORT, env.HOST, () => {
  console.log(`Benchwire is running at http://${env.HOST}:${env.PORT}  (Ctrl-C stops it)`);
});

// Scheduled work runs beside the requests; overdue jobs (the server was down at their time) go first.
const jobRunner = new JobRunner(dataSource, createJobRegistry(services), { pollIntervalMs: env.JOB_POLL_MS });
if (env.JOB_RUNNER === 'on') jobRunner.start();

let closing = false;
async function shutdown() {
  if (closing) return;
  closing = true;
  server.close();
  server.closeIdleConnections();
  await jobRunner.stop().catch(() => {});
  await mailWorker.stop().catch(() => {});
  services.publishedPages.stopWatching();
  await services.logFileAnalyser.close().catch(() => {});
  await dataSource.destroy().catch(() => {});
  process.exit(0);
}
process.on('SIGINT', shutdown);
process.on('SIGTERM', shutdown);
