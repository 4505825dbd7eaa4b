// `npm run bench:mail`: a go-live mailing to 10,000 test subscribers through the outbox and the local relay, and in the
// same run the same messages through nodemailer's pooled transport alone (the baseline), both into the same relay.
// Prints messages per second for both, their ratio, and memory at the start, middle and end of the outbox run.
// Needs DATABASE_URL naming a MariaDB server; it works in a database of its own and drops it afterwards.
import { spawnSync } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { resolve } from 'node:path';
import { createDataSource, initializeDataSource } from '../server/data-source';
import { loadEnv } from '../server/env';
import { createServices } from '../server/compose-services';
import { RoundupEntity } from '../server/entities/roundup.entity';
import { databaseRelayStore, startLocalRelay } from '../server/mail/local-relay';
import { enqueueGoLiveMailing } from '../server/mail/outbox';
import { goLiveMessage, listHeaders, parseFrom } from '../server/mail/compose';
import { loadMailingContent } from '../server/mail/go-live-content';
import { createMailTransport } from '../server/mail/transport';

const SUBSCRIBERS = Number(process.env.BENCH_MAIL_SUBSCRIBERS ?? 10_000);
const BATCH = 100;

const base = process.env.DATABASE_URL;
if (!base) {
  console.error('Set DATABASE_URL to a MariaDB server (the bench makes and drops a database of its own).');
  process.exit(1);
}
const url = new URL(base);
url.pathname = `/benchwire_bench_mail_${process.pid}_${randomBytes(2).toString('hex')}`;
const databaseUrl = url.toString();
const tsx = resolve('node_modules/.bin/tsx');
const setup = (flag: string) =>
  spawnSync(tsx, ['server/cli/setup-database.ts', flag, '--quiet'], {
    env: { ...process.env, DATABASE_URL: databaseUrl },
    stdio: 'inherit',
  });

const mb = (bytes: number) => `${(bytes / 1024 / 1024).toFixed(1)} MB`;
const memory = (label: string) => {
  const m = process.memoryUsage();
  return `${label.padEnd(7)} rss ${mb(m.rss).padStart(9)}  heap ${mb(m.heapUsed).padStart(9)}`;
};

if (setup('--fresh').status !== 0) process.exit(1);
const relay = await startLocalRelay({ store: databaseRelayStore(databaseUrl) });
const dataSource = await initializeDataSource(createDataSource(databaseUrl, { poolSize: 8 }));
try {
  const env = loadEnv({
    ...process.env,
    DATABASE_URL: databaseUrl,
    SMTP_URL: relay.url,
    PUBLIC_SITE_URL: 'https://results.soaksheet.example',
    MAIL_FROM: 'The Soak Sheet <news@soaksheet.example>',
    MAIL_BATCH_SIZE: String(BATCH),
  });
  const services = createServices(dataSource, env);

  const rows = Array.from({ length: SUBSCRIBERS }, (_, i) => [`bench-${i}@readers.soaksheet.example`, 'confirmed']);
  for (let i = 0; i < rows.length; i += 2000) {
    await dataSource.query('INSERT INTO subscribers (email, status) VALUES ?', [rows.slice(i, i + 2000)]);
  }
  await dataSource.query(
    "INSERT INTO subscriber_categories (subscriber_id, category_id) SELECT s.id, c.id FROM subscribers s JOIN mail_categories c ON c.name = 'Every new roundup'",
  );
  const roundup = await dataSource.getRepository(RoundupEntity).save(
    dataSource.getRepository(RoundupEntity).create({
      title: 'Helix-1700 boards under a one-hour soak',
      category: 'motherboard',
      platform: 'Helix-1700',
      state: 'live',
      priceMinMinor: 10000,
      priceMaxMinor: 30000,
      currency: 'EUR',
      region: 'EU',
      timeZone: 'Europe/Berlin',
      stateChangedAt: new Date(),
    }),
  );

  // 1. The outbox: queue in one transaction, then the sender drains it in batches.
  const memoryLines = [memory('start')];
  const queueStarted = performance.now();
  const { queued } = await dataSource.transaction((manager) => enqueueGoLiveMailing(manager, roundup.id));
  const queueMs = performance.now() - queueStarted;
  const outboxStarted = performance.now();
  let sent = 0;
  let middleTaken = false;
  for (;;) {
    const batch = await services.mailSender.sendBatch();
    sent += batch.sent;
    if (!middleTaken && sent >= queued / 2) {
      memoryLines.push(memory('middle'));
      middleTaken = true;
    }
    if (batch.claimed === 0) break;
  }
  const outboxSeconds = (performance.now() - outboxStarted) / 1000;
  memoryLines.push(memory('end'));

  // 2. The baseline: the same messages straight through a pooled transport of the same size.
  const transport = createMailTransport(relay.url)!;
  const content = await loadMailingContent(
    dataSource.manager,
    { roundupId: roundup.id, kind: 'go-live', note: null },
    { siteUrl: 'https://results.soaksheet.example', outletName: 'The Soak Sheet' },
  );
  const from = parseFrom(env.MAIL_FROM);
  const baselineStarted = performance.now();
  for (let i = 0; i < SUBSCRIBERS; i += BATCH) {
    await Promise.all(
      rows.slice(i, i + BATCH).map(([address], j) => {
        const token = `${i + j + 1}.1.${'x'.repeat(32)}`;
        const links = {
          oneClick: `https://results.soaksheet.example/unsubscribe/${token}`,
          mailto: `mailto:unsubscribe@${from.domain}?subject=unsubscribe%20${token}`,
          manage: `https://results.soaksheet.example/subscribe/manage/${token}`,
        };
        return transport.sendMail({
          from: { name: from.name, address: from.address },
          to: address,
          messageId: `<baseline-${i + j}.${process.pid}@${from.domain}>`,
          ...goLiveMessage(content, links),
          headers: listHeaders(links, `roundups.${from.domain}`),
        });
      }),
    );
  }
  const baselineSeconds = (performance.now() - baselineStarted) / 1000;
  transport.close();

  const outboxRate = sent / outboxSeconds;
  const baselineRate = SUBSCRIBERS / baselineSeconds;
  console.log(`\nGo-live mailing to ${SUBSCRIBERS} subscribers through the local relay (${relay.stats.stored} kept)`);
  console.log(`  queued in the publish transaction: ${queued} rows in ${queueMs.toFixed(0)} ms`);
  console.log(
    `  outbox sender:              ${outboxRate.toFixed(0).padStart(6)} messages/s (${sent} in ${outboxSeconds.toFixed(1)} s)`,
  );
  console.log(
    `  pooled transport alone:     ${baselineRate.toFixed(0).padStart(6)} messages/s (${SUBSCRIBERS} in ${baselineSeconds.toFixed(1)} s)`,
  );
  console.log(`  ratio outbox / baseline:    ${(outboxRate / baselineRate).toFixed(2)}× (target ≥ 0.7×)`);
  console.log('  memory during the outbox run:');
  for (const line of memoryLines) console.log(`    ${line}`);
} finally {
  await dataSource.destroy();
  await relay.close();
  setup('--drop');
}
