import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { simpleParser } from 'mailparser';
import { databaseRelayStore, startLocalRelay, type LocalRelay } from '../../../server/mail/local-relay';
import { enqueueGoLiveMailing } from '../../../server/mail/outbox';
import { testDataSource, testEnv } from '../support/test-app';
import { createRoundup, rawHeader } from './mail-support';

// The mail fault drill: 2,000 confirmed subscribers, a relay that fails temporarily part-way, and a sender process
// killed with SIGKILL mid-send and started again. Every confirmed subscriber must end with exactly one message;
// pending and unsubscribed addresses with none. `npm run drill:mail` runs the same drill with 5,000 (MAIL_DRILL_CONFIRMED)
// in a database of its own and prints its figures.
const CONFIRMED = Number(process.env.MAIL_DRILL_CONFIRMED ?? 2000);
// The sender is killed part-way: after this many of the run's messages are in the relay.
const KILL_AT = Math.round(CONFIRMED * 0.45);
const PENDING = 50;
const UNSUBSCRIBED = 50;
const run = randomBytes(4).toString('hex');
const address = (kind: string, i: number) => `drill-${run}-${kind}-${i}@drill.soaksheet.example`;

let relay: LocalRelay;
const children: ChildProcess[] = [];

function startSender(): ChildProcess {
  // One process (Node with tsx's loader), so SIGKILL reaches the sender itself, not a wrapper around it.
  const child = spawn(process.execPath, ['--import', 'tsx', resolve('server/cli/mail-sender.ts')], {
    env: {
      ...process.env,
      NODE_ENV: 'test',
      DATABASE_URL: testEnv().DATABASE_URL,
      SMTP_URL: relay.url,
      PUBLIC_SITE_URL: 'https://results.soaksheet.example',
      MAIL_FROM: 'The Soak Sheet <news@soaksheet.example>',
      MAIL_BATCH_SIZE: '50',
      // Short enough for a test: a killed sender's rows come back after two seconds, retries after a tenth.
      MAIL_LEASE_SECONDS: '2',
      MAIL_RETRY_BASE_SECONDS: '0.1',
      MAIL_POLL_MS: '100',
    },
    stdio: 'ignore',
  });
  children.push(child);
  return child;
}

async function until(condition: () => Promise<boolean>, timeoutMs: number, what: string) {
  const deadline = Date.now() + timeoutMs;
  while (!(await condition())) {
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

beforeAll(async () => {
  relay = await startLocalRelay({ store: databaseRelayStore(testEnv().DATABASE_URL) });
});
afterAll(async () => {
  for (const child of children) if (child.exitCode === null) child.kill('SIGKILL');
  await relay.close();
});

describe('mail fault drill', () => {
  it(
    'a relay failing part-way and a sender killed mid-send still leave every confirmed subscriber exactly one message',
    async () => {
      const ds = await testDataSource();
      const platform = `Drill-${run}`;
      const category: { insertId: number } = await ds.query(
        'INSERT INTO mail_categories (name, match_platform, position) VALUES (?, ?, 900)',
        [`Drill ${run}`, platform],
      );
      const rows: unknown[][] = [];
      for (let i = 0; i < CONFIRMED; i++) rows.push([address('confirmed', i), 'confirmed']);
      for (let i = 0; i < PENDING; i++) rows.push([address('pending', i), 'pending']);
      for (let i = 0; i < UNSUBSCRIBED; i++) rows.push([address('unsubscribed', i), 'unsubscribed']);
      await ds.query('INSERT INTO subscribers (email, status) VALUES ?', [rows]);
      await ds.query(
        'INSERT INTO subscriber_categories (subscriber_id, category_id) SELECT id, ? FROM subscribers WHERE email LIKE ?',
        [category.insertId, `drill-${run}-%`],
      );
      const roundup = await createRoundup({ platform });
      const { mailingId, queued } = await ds.transaction((manager) => enqueueGoLiveMailing(manager, roundup.id));
      // Subscribers of every roundup (from other tests in this database) are in the mailing too.
      expect(queued).toBeGreaterThanOrEqual(CONFIRMED);

      const storedForRun = async () =>
        Number(
          (await ds.query('SELECT COUNT(*) AS n FROM relay_messages WHERE recipient LIKE ?', [`drill-${run}-%`]))[0].n,
        );
      // The relay accepts 400 messages, then refuses the next 60 with 451 (temporary).
      relay.failTemporarilyAfter(400, 60);
      const started = Date.now();
      const first = startSender();
      await until(
        async () => (await storedForRun()) >= KILL_AT,
        60_000 + CONFIRMED * 60,
        `the first ${KILL_AT} messages`,
      );
      first.kill('SIGKILL');
      await new Promise((r) => first.once('exit', r));
      const atKill = await storedForRun();
      expect(atKill).toBeLessThan(CONFIRMED);

      const second = startSender();
      const open = async () =>
        Number(
          (
            await ds.query(
              "SELECT COUNT(*) AS n FROM mail_outbox WHERE mailing_id = ? AND state IN ('queued','sending','deferred')",
              [mailingId],
            )
          )[0].n,
        );
      await until(async () => (await open()) === 0, 90_000 + CONFIRMED * 90, 'the outbox to empty');
      const finished = Date.now();
      second.kill('SIGTERM');
      await new Promise((r) => second.once('exit', r));

      expect(relay.stats.deferred).toBeGreaterThanOrEqual(60);
      const perRecipient: { recipient: string; n: string }[] = await ds.query(
        'SELECT recipient, COUNT(*) AS n FROM relay_messages WHERE recipient LIKE ? GROUP BY recipient',
        [`drill-${run}-%`],
      );
      const counts = new Map(perRecipient.map((r) => [r.recipient, Number(r.n)]));
      const missing = [];
      const twice = [];
      for (let i = 0; i < CONFIRMED; i++) {
        const n = counts.get(address('confirmed', i)) ?? 0;
        if (n === 0) missing.push(i);
        if (n > 1) twice.push(i);
      }
      expect(missing, 'confirmed subscribers without their message').toEqual([]);
      expect(twice, 'confirmed subscribers with more than one').toEqual([]);
      for (let i = 0; i < PENDING; i++) expect(counts.get(address('pending', i))).toBeUndefined();
      for (let i = 0; i < UNSUBSCRIBED; i++) expect(counts.get(address('unsubscribed', i))).toBeUndefined();
      const states: { state: string; n: string }[] = await ds.query(
        `SELECT o.state, COUNT(*) AS n FROM mail_outbox o JOIN subscribers s ON s.id = o.subscriber_id
        WHERE o.mailing_id = ? AND s.email LIKE ? GROUP BY o.state`,
        [mailingId, `drill-${run}-%`],
      );
      expect(Object.fromEntries(states.map((s) => [s.state, Number(s.n)]))).toEqual({ sent: CONFIRMED });
      if (process.env.MAIL_DRILL_CONFIRMED) {
        console.log(
          [
            `Mail fault drill: ${CONFIRMED} confirmed, ${PENDING} pending, ${UNSUBSCRIBED} unsubscribed subscribers`,
            `  sender killed (SIGKILL) with ${atKill} of the run's messages in the relay; restarted`,
            `  relay: ${relay.stats.deferred} answered 451 on purpose, ${relay.stats.duplicates} resent copies dropped by Message-ID`,
            `  every confirmed subscriber with exactly one message: ${missing.length} missing, ${twice.length} twice`,
            `  pending/unsubscribed with mail: 0; outbox rows of the run: ${CONFIRMED} sent`,
            `  first send to empty outbox: ${((finished - started) / 1000).toFixed(1)} s`,
          ].join('\n'),
        );
      }

      // What readers receive: both unsubscribe headers (RFC 2369, RFC 8058) and a plain-text part.
      const sample: { raw: Buffer }[] = await ds.query(
        'SELECT raw FROM relay_messages WHERE recipient LIKE ? ORDER BY RAND() LIMIT 20',
        [`drill-${run}-%`],
      );
      for (const { raw } of sample) {
        const mail = await simpleParser(raw);
        expect(rawHeader(mail, 'list-unsubscribe')).toMatch(/^<https:\/\/[^>]+\/unsubscribe\/[^>]+>, <mailto:[^>]+>$/);
        expect(rawHeader(mail, 'list-unsubscribe-post')).toBe('List-Unsubscribe=One-Click');
        expect(mail.text).toContain(roundup.title);
      }
    },
    400_000 + CONFIRMED * 200,
  );
});
