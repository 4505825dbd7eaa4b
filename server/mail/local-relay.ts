// The local mail relay for development and tests: an SMTP server on 127.0.0.1 (smtp-server) that parses each
// message (mailparser) and keeps it in MariaDB, where the staff app's dev inbox reads it. It never forwards mail.
//
// De-duplication: a message whose Message-ID it already holds is answered 250 and dropped. The outbox gives every
// row a Message-ID of its own, so a sender that crashed after the relay accepted a message and before it wrote
// "sent" can resend safely: each recipient still holds exactly one copy (see server/mail/mail-sender.ts).
//
// Fault drills: `failTemporarilyAfter(n, count)` makes it accept n more messages and then answer the next `count`
// MAIL FROM commands with 451 (a temporary failure, which a sender must retry later); recipients matching
// `rejectRecipient` are refused with 550 (a permanent failure, which a sender must not retry).
import { createPool, type Pool } from 'mysql2/promise';
import { simpleParser } from 'mailparser';
import { SMTPServer, type SMTPServerSession } from 'smtp-server';
import type { AddressInfo } from 'node:net';
import { connectionOptions } from '../data-source';

export interface RelayedMessage {
  messageId: string | null;
  mailFrom: string;
  recipients: string[];
  subject: string;
  raw: Buffer;
  receivedAt: Date;
}

export interface RelayStore {
  /** 'duplicate' when a message with the same Message-ID is already kept. */
  save(message: RelayedMessage): Promise<'stored' | 'duplicate'>;
  close(): Promise<void>;
}

/** Keeps relayed messages in the relay_messages table of the database DATABASE_URL names. */
export function databaseRelayStore(databaseUrl: string): RelayStore {
  const { host, port, username, password, database } = connectionOptions(databaseUrl);
  const pool: Pool = createPool({
    host,
    port,
    user: username,
    password,
    database,
    connectionLimit: 4,
    timezone: 'Z',
    charset: 'utf8mb4_unicode_ci',
  });
  return {
    async save(message) {
      const [result] = await pool.query(
        `INSERT IGNORE INTO relay_messages
           (message_id, mail_from, recipient, recipients, subject, size_bytes, received_at, raw)
         VALUES (?, ?, ?, ?, ?, ?, ?, ?)`,
        [
          message.messageId,
          message.mailFrom.slice(0, 320),
          (message.recipients[0] ?? '').slice(0, 320),
          JSON.stringify(message.recipients),
          message.subject.slice(0, 998),
          message.raw.length,
          message.receivedAt,
          message.raw,
        ],
      );
      return (result as { affectedRows: number }).affectedRows === 1 ? 'stored' : 'duplicate';
    },
    close: () => pool.end(),
  };
}

export interface LocalRelayOptions {
  store: RelayStore;
  host?: string;
  /** 0 (the default) picks a free port. */
  port?: number;
  /** Accept this many messages, then answer the next `failCount` with 451. */
  failAfter?: number;
  failCount?: number;
  /** Recipients refused with 550 5.1.1. By default, addresses at the reserved domain bounce.invalid. */
  rejectRecipient?: (address: string) => boolean;
  /** Largest message accepted, in bytes. */
  maxBytes?: number;
}

export interface RelayStats {
  stored: number;
  duplicates: number;
  deferred: number;
  rejected: number;
}

export interface LocalRelay {
  host: string;
  port: number;
  /** smtp://host:port, for SMTP_URL. */
  url: string;
  stats: RelayStats;
  /** Accept `after` more messages, then answer the next `count` with a temporary failure (451). */
  failTemporarilyAfter(after: number, count: number): void;
  close(): Promise<void>;
}

const defaultReject = (address: string) => /@bounce\.invalid$/i.test(address);

class SmtpReply extends Error {
  constructor(
    readonly responseCode: number,
    message: string,
  ) {
    super(message);
  }
}

export async function startLocalRelay(options: LocalRelayOptions): Promise<LocalRelay> {
  const host = options.host ?? '127.0.0.1';
  const rejectRecipient = options.rejectRecipient ?? defaultReject;
  const stats: RelayStats = { stored: 0, duplicates: 0, deferred: 0, rejected: 0 };
  // Messages still to accept before failing, and failures still to give; null = not armed.
  let acceptBeforeFailing: number | null = options.failAfter ?? null;
  let failuresLeft = options.failCount ?? 0;

  const server = new SMTPServer({
    name: 'benchwire-local-relay',
    banner: 'Benchwire local relay: keeps every message, forwards none',
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    logger: false,
    size: options.maxBytes ?? 25 * 1024 * 1024,
    onMailFrom(_address, _session, callback) {
      if (acceptBeforeFailing !== null && acceptBeforeFailing <= 0 && failuresLeft > 0) {
        failuresLeft -= 1;
        stats.deferred += 1;
        if (failuresLeft === 0) acceptBeforeFailing = null;
        return callback(new SmtpReply(451, '4.3.0 Local relay is failing on purpose; try again later'));
      }
      callback();
    },
    onRcptTo(address, _session, callback) {
      if (rejectRecipient(address.address)) {
        stats.rejected += 1;
        return callback(new SmtpReply(550, '5.1.1 No such mailbox here'));
      }
      callback();
    },
    onData(stream, session: SMTPServerSession, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('error', (error) => callback(error));
      stream.on('end', () => {
        if ((stream as unknown as { sizeExceeded?: boolean }).sizeExceeded) {
          return callback(new SmtpReply(552, '5.3.4 Message too big'));
        }
        const raw = Buffer.concat(chunks);
        keep(raw, session).then(
          () => callback(null, 'Kept by the local relay'),
          (error: Error) =>
            callback(new SmtpReply(451, `4.3.0 Could not keep the message: ${error.message.slice(0, 200)}`)),
        );
      });
    },
  });

  async function keep(raw: Buffer, session: SMTPServerSession) {
    const parsed = await simpleParser(raw, {
      skipHtmlToText: true,
      skipTextToHtml: true,
      skipImageLinks: true,
      skipTextLinks: true,
    });
    const mailFrom = session.envelope.mailFrom ? session.envelope.mailFrom.address : '';
    const outcome = await options.store.save({
      messageId: parsed.messageId ? parsed.messageId.slice(0, 255) : null,
      mailFrom,
      recipients: session.envelope.rcptTo.map((to) => to.address),
      subject: parsed.subject ?? '',
      raw,
      receivedAt: new Date(),
    });
    if (outcome === 'stored') stats.stored += 1;
    else stats.duplicates += 1;
    if (acceptBeforeFailing !== null && acceptBeforeFailing > 0) acceptBeforeFailing -= 1;
  }

  server.on('error', () => {
    // A client that drops its connection is its own problem; the relay keeps listening.
  });

  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port ?? 0, host, () => resolve());
  });
  const port = (server.server.address() as AddressInfo).port;

  return {
    host,
    port,
    url: `smtp://${host}:${port}`,
    stats,
    failTemporarilyAfter(after, count) {
      acceptBeforeFailing = after;
      failuresLeft = count;
    },
    async close() {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await options.store.close();
    },
  };
}
