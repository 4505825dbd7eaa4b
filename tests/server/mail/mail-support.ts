import { simpleParser, type ParsedMail } from 'mailparser';
import { createApp } from '../../../server/app';
import { createServices } from '../../../server/compose-services';
import { RoundupEntity } from '../../../server/entities/roundup.entity';
import { liveRoundupRow } from '../../support/live-roundup';
import { databaseRelayStore, startLocalRelay, type LocalRelay } from '../../../server/mail/local-relay';
import type { Env } from '../../../server/env';
import { testDataSource, testEnv } from '../support/test-app';

/** A local relay keeping messages in the test database, and an app whose services send through it. */
export async function mailTestContext(overrides: Partial<Record<keyof Env, string>> = {}) {
  const relay = await startLocalRelay({ store: databaseRelayStore(testEnv().DATABASE_URL) });
  const dataSource = await testDataSource();
  const env = testEnv({
    SMTP_URL: relay.url,
    LOCAL_MAIL_RELAY: 'true',
    PUBLIC_SITE_URL: 'https://results.soaksheet.example',
    MAIL_FROM: 'The Soak Sheet <news@soaksheet.example>',
    SUBSCRIBE_LIMIT_PER_IP: '100000',
    ...overrides,
  });
  const services = createServices(dataSource, env);
  const app = createApp({ dataSource, env, services });
  return { relay, dataSource, env, services, app };
}

export type MailTestContext = Awaited<ReturnType<typeof mailTestContext>>;

export async function closeMailTestContext(context: { relay: LocalRelay; services: { mailSender: unknown } }) {
  await context.relay.close();
}

/** Runs `check` against an app of its own with other settings, and closes its relay afterwards whatever happens. */
export async function withMailTestContext<T>(
  overrides: Partial<Record<keyof Env, string>>,
  check: (context: MailTestContext) => Promise<T>,
): Promise<T> {
  const context = await mailTestContext(overrides);
  try {
    return await check(context);
  } finally {
    await closeMailTestContext(context);
  }
}

/**
 * Sends what is due and waits until no due row is left: other test files send from the same outbox at the same
 * time (SKIP LOCKED hands each row to one sender), so a row this file queued may be in another sender's hands.
 */
export async function sendAll(sender: { drain(): Promise<unknown> }, timeoutMs = 120_000) {
  const ds = await testDataSource();
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    await sender.drain();
    const [{ n }] = await ds.query(
      `SELECT COUNT(*) AS n FROM mail_outbox o LEFT JOIN subscribers s ON s.id = o.subscriber_id
        WHERE o.state IN ('queued', 'sending') AND o.next_attempt_at <= NOW(3)
          AND (s.email IS NULL OR s.email NOT LIKE 'drill-%')`,
    );
    if (Number(n) === 0) return;
    if (Date.now() > deadline) throw new Error('the outbox did not settle');
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** Every message the relay kept for an address, parsed. */
export async function messagesTo(address: string, options: { keepCidLinks?: boolean } = {}): Promise<ParsedMail[]> {
  const ds = await testDataSource();
  const rows: { raw: Buffer }[] = await ds.query('SELECT raw FROM relay_messages WHERE recipient = ? ORDER BY id', [
    address,
  ]);
  return Promise.all(rows.map((row) => simpleParser(row.raw, options)));
}

let roundupCounter = 0;
/** A roundup straight into the table, in the given state (no planning steps needed for mail). */
export async function createRoundup(overrides: Partial<RoundupEntity> = {}): Promise<RoundupEntity> {
  const ds = await testDataSource();
  roundupCounter += 1;
  const repo = ds.getRepository(RoundupEntity);
  return repo.save(
    repo.create({
      ...liveRoundupRow(`Helix-1700 boards under a soak ${Date.now()}-${roundupCounter}`),
      ...overrides,
    }),
  );
}

/** A header as it stands in the message, unfolded (mailparser turns List-* headers into objects). */
export function rawHeader(mail: ParsedMail, name: string): string | undefined {
  const line = mail.headerLines.find((h) => h.key === name.toLowerCase())?.line;
  return line
    ?.slice(line.indexOf(':') + 1)
    .replace(/\r?\n[ \t]+/g, ' ')
    .trim();
}

/** The link in a plain-text part that starts with `prefix`. */
export function linkIn(text: string | undefined, prefix: string): string {
  const found = (text ?? '').split(/\s+/).find((word) => word.startsWith(prefix));
  if (!found) throw new Error(`no link starting with ${prefix} in:\n${text}`);
  return found;
}
