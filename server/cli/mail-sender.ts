// The outbox sender on its own, as the server process runs it (server/mail/mail-worker.ts): sends whatever is due,
// then looks again every MAIL_POLL_MS (default 500). The mail fault drill kills and restarts it mid-send.
import { createServices } from '../compose-services';
import { createDataSource, initializeDataSource } from '../data-source';
import { loadEnv } from '../env';
import { MailWorker } from '../mail/mail-worker';

const env = loadEnv();
const dataSource = await initializeDataSource(createDataSource(env.DATABASE_URL, { poolSize: 4 }));
const services = createServices(dataSource, env);
if (!services.mailSender.enabled) {
  console.error('[mail sender] SMTP_URL is not set: nothing to send through.');
  process.exit(1);
}
const worker = new MailWorker(services.mailSender, [], Number(process.env.MAIL_POLL_MS ?? 500));
worker.start();
// The worker's timer does not hold the process open (the server's must not); this one does.
const keepAlive = setInterval(() => {}, 60_000);
console.log('[mail sender] sending');

async function stop() {
  clearInterval(keepAlive);
  await worker.stop().catch(() => {});
  await dataSource.destroy().catch(() => {});
  process.exit(0);
}
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
