// `npm run bench:mail`: a go-live mailing to 10,000 test subscribers through the outbox and the local relay, and in the
// same run the same messages through nodemailer's pooled transport alone (the baseline), both into the same relay.
// Prints messages per second for both, their ratio, and memory (after a full garbage collection, so it shows what
// stays alive) at each tenth of the outbox run. The baseline runs in two halves, one before and one after the outbox
// run, so that a machine growing busier or a relay table growing larger during the run favours neither side.
// Needs DATABASE_URL naming a MariaDB server; it works in a database of its own and drops it afterwards.
import { spawnSync } from 'node:child_process';
import { resolve } from 'node:path';
import { loadavg } from 'node:os';
import { setFlagsFromString } from 'node:v8';
import { runInNewContext } from 'node:vm';
import { createDataSource, initializeDataSource } from '../server/data-source';
import { loadEnv } from '../server/env';
import { createCanvas } from '@napi-rs/canvas';
import { LinkSecret } from '../server/mail/link-secret';
import { MailSender } from '../server/mail/mail-sender';
import { RoundupEntity } from '../server/entities/roundup.entity';
import { liveRoundupRow } from '../tests/support/live-roundup';
import { databaseRelayStore, startLocalRelay } from '../server/mail/local-relay';
import { enqueueGoLiveMailing } from '../server/mail/outbox';
import { goLiveMessage, listHeaders, parseFrom } from '../server/mail/compose';
import { loadMailingContent } from '../server/mail/go-live-content';
import { createMailTransport } from '../server/mail/transport';
import { scratchDatabaseUrl } from './lib/app-process';

const SUBSCRIBERS = Number(process.env.BENCH_MAIL_SUBSCRIBERS ?? 10_000);
const BATCH = 100;

const url = scratchDatabaseUrl('benchwire_bench_mail', 'the bench');
const databaseUrl = url.toString();
const tsx = resolve('node_modules/.bin/tsx');
const setup = (flag: string) =>
  spawnSync(tsx, ['server/cli/setup-database.ts', flag, '--quiet'], {
    env: { ...process.env, DATABASE_URL: databaseUrl },
    stdio: 'inherit',
  });

// A full collection before each reading: heap used then is what the run keeps alive, not garbage not yet collected.
setFlagsFromString('--expose-gc');
const collect = runInNewContext('gc') as () => void;
const mb = (bytes: number) => `${(bytes / 1024 / 1024).toFixed(1)} MB`;
const heapReadings: number[] = [];
const memory = (label: string) => {
  collect();
  const m = process.memoryUsage();
  heapReadings.push(m.heapUsed);
  return `${label.padEnd(12)} heap ${mb(m.heapUsed).padStart(9)}  rss ${mb(m.rss).padStart(9)}  buffers ${mb(m.arrayBuffers).padStart(8)}`;
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
  // Every go-live mail carries the roundup's chart inline: a 1200×630 PNG of bars, the size of an approved chart.
  const canvas = createCanvas(1200, 630);
  const g = canvas.getContext('2d');
  g.fillStyle = '#FAF8F3';
  g.fillRect(0, 0, 1200, 630);
  g.font = '22px sans-serif';
  for (let i = 0; i < 10; i++) {
    g.fillStyle = '#1B2433';
    g.fillText(`Board ${i + 1}`, 24, 70 + i * 54);
    g.fillStyle = i % 2 ? '#A4521F' : '#3B6E8F';
    g.fillRect(200, 48 + i * 54, 300 + ((i * 97) % 600), 32);
  }
  const chart = { png: await canvas.encode('png'), alt: 'Chart: peak VRM temperature under the stock all-core load.' };
  const content = {
    siteUrl: 'https://results.soaksheet.example',
    outletName: 'The Soak Sheet',
    chartPng: async () => chart,
  };
  const senderTransport = createMailTransport(relay.url)!;
  const sender = new MailSender({
    dataSource,
    transport: senderTransport,
    from: env.MAIL_FROM,
    siteUrl: content.siteUrl,
    secret: new LinkSecret(dataSource, env.MAIL_LINK_SECRET),
    content,
    batchSize: BATCH,
  });

  const rows = Array.from({ length: SUBSCRIBERS }, (_, i) => [`bench-${i}@readers.soaksheet.example`, 'confirmed']);
  for (let i = 0; i < rows.length; i += 2000) {
    await dataSource.query('INSERT INTO subscribers (email, status) VALUES ?', [rows.slice(i, i + 2000)]);
  }
  await dataSource.query(
    "INSERT INTO subscriber_categories (subscriber_id, category_id) SELECT s.id, c.id FROM subscribers s JOIN mail_categories c ON c.name = 'Every new roundup'",
  );
  const roundup = await dataSource
    .getRepository(RoundupEntity)
    .save(dataSource.getRepository(RoundupEntity).create(liveRoundupRow('Helix-1700 boards under a one-hour soak')));

  // The baseline: the same messages straight through a pooled transport of the same size, batch by batch.
  const transport = createMailTransport(relay.url)!;
  const mailContent = await loadMailingContent(
    dataSource.manager,
    { roundupId: roundup.id, kind: 'go-live', note: null },
    content,
  );
  const from = parseFrom(env.MAIL_FROM);
  const baseline = async (start: number, end: number) => {
    const started = performance.now();
    for (let i = start; i < end; i += BATCH) {
      await Promise.all(
        rows.slice(i, Math.min(i + BATCH, end)).map(([address], j) => {
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
            ...goLiveMessage(mailContent, links),
            headers: listHeaders(links, `roundups.${from.domain}`),
          });
        }),
      );
    }
    return (performance.now() - started) / 1000;
  };
  const half = Math.floor(SUBSCRIBERS / 2);
  const load = [loadavg()[0]];
  const baselineBefore = await baseline(0, half);

  // The outbox: queue in one transaction, then the sender drains it in batches.
  const memoryLines = [memory('start')];
  const queueStarted = performance.now();
  const { queued } = await dataSource.transaction((manager) => enqueueGoLiveMailing(manager, roundup.id));
  const queueMs = performance.now() - queueStarted;
  const outboxStarted = performance.now();
  let sent = 0;
  let pausedMs = 0;
  let nextReading = 1;
  // The sender as the server runs it: drain() claims the next batch while the current one is on the wire.
  await sender.drain(undefined, (batch) => {
    sent += batch.sent;
    if (sent >= (queued * nextReading) / 10 && nextReading < 10) {
      // The reading's own collection is not the sender's time.
      const paused = performance.now();
      memoryLines.push(memory(`${nextReading * 10} % sent`));
      pausedMs += performance.now() - paused;
      nextReading += 1;
    }
  });
  const outboxSeconds = (performance.now() - outboxStarted - pausedMs) / 1000;
  memoryLines.push(memory('end'));
  senderTransport.close();
  load.push(loadavg()[0]);

  const baselineAfter = await baseline(half, SUBSCRIBERS);
  load.push(loadavg()[0]);
  const baselineSeconds = baselineBefore + baselineAfter;
  transport.close();

  const outboxRate = sent / outboxSeconds;
  const baselineRate = SUBSCRIBERS / baselineSeconds;
  console.log(`\nGo-live mailing to ${SUBSCRIBERS} subscribers through the local relay (${relay.stats.stored} kept)`);
  console.log(`  each message carries a ${(chart.png.length / 1024).toFixed(0)} KB chart PNG inline`);
  console.log(`  queued in the publish transaction: ${queued} rows in ${queueMs.toFixed(0)} ms`);
  console.log(
    `  outbox sender:              ${outboxRate.toFixed(0).padStart(6)} messages/s (${sent} in ${outboxSeconds.toFixed(1)} s)`,
  );
  console.log(
    `  pooled transport alone:     ${baselineRate.toFixed(0).padStart(6)} messages/s (${SUBSCRIBERS} in ${baselineSeconds.toFixed(1)} s)`,
  );
  console.log(`  ratio outbox / baseline:    ${(outboxRate / baselineRate).toFixed(2)}× (target ≥ 0.7×)`);
  console.log(
    `  baseline halves:            ${(half / baselineBefore).toFixed(0)} messages/s before, ${((SUBSCRIBERS - half) / baselineAfter).toFixed(0)} after the outbox run`,
  );
  console.log(`  load average (1 min):       ${load.map((l) => l.toFixed(1)).join(' → ')}`);
  console.log('  memory during the outbox run (after a full collection; relay and sender share this process):');
  for (const line of memoryLines) console.log(`    ${line}`);
  const growth = heapReadings.at(-1)! - heapReadings[0];
  const peak = Math.max(...heapReadings) - heapReadings[0];
  console.log(`  heap growth start → end:    ${mb(growth)} (largest above start: ${mb(peak)})`);
} finally {
  await dataSource.destroy();
  await relay.close();
  setup('--drop');
}
