// The outbox sender. Each batch claims due rows with SELECT … FOR UPDATE SKIP LOCKED (so several senders never take
// the same row), marks them 'sending' with a lease and commits before any SMTP call, sends through the pooled
// transport, then marks them 'sent' (or 'deferred' with backoff after a 4xx, or 'failed' after a 5xx, which also
// suppresses the address).
//
// Delivery choice: at least once, made exactly once by the Message-ID. A sender killed after the relay accepted a
// message and before it wrote 'sent' leaves the row 'sending'; when the lease runs out, the row is claimed again
// and sent again with the same Message-ID (`<outbox-<row id>@domain>`). The local relay keeps one message per
// Message-ID, so every recipient holds exactly one copy; real relays and mailbox providers commonly drop a repeat
// of a Message-ID they just delivered too. The other choice (never resend a row left 'sending') would lose the
// mails of a crash instead, which the fault drill forbids: no gap.
import { createHash } from 'node:crypto';
import type { SendMailOptions, Transporter } from 'nodemailer';
import { In, type DataSource } from 'typeorm';
import {
  MailOptOutEntity,
  OutboxEntity,
  SubscriberEntity,
  type MailingEntity,
  type OutboxState,
} from '../entities/mail.entities';
import { UserEntity } from '../entities/user.entity';
import { goLiveMessage, listHeaders, oneLine, parseFrom, plainMessage, type GoLiveContent } from './compose';
import { loadMailingContent, mailingsById, type ContentSettings } from './go-live-content';
import { manageToken, type LinkSecret } from './link-secret';

export interface MailSenderOptions {
  dataSource: DataSource;
  /** null: nothing is sent (no SMTP_URL); rows wait in the outbox. */
  transport: Transporter | null;
  from: string;
  siteUrl: string;
  secret: LinkSecret;
  content: ContentSettings;
  batchSize?: number;
  /** How long a claimed row stays with this sender before another may take it. */
  leaseMs?: number;
  maxAttempts?: number;
  /** The first retry waits this long; each later one twice as long, at most an hour. */
  retryBaseMs?: number;
  clock?: () => Date;
}

export interface BatchResult {
  claimed: number;
  sent: number;
  deferred: number;
  failed: number;
  suppressed: number;
}

const subscriberMailings = new Set(['go-live', 'update', 'correction']);

interface PlannedRow {
  row: OutboxEntity;
  /** null: the row is not to be sent (suppressed, unconfirmed, opted out, or no address). */
  address: string | null;
  subscriber: SubscriberEntity | undefined;
}

interface PreparedBatch {
  now: Date;
  rows: OutboxEntity[];
  plans: PlannedRow[];
  mailings?: Map<number, MailingEntity>;
}

interface Outcome {
  row: OutboxEntity;
  state: Exclude<OutboxState, 'queued' | 'sending'>;
  error?: string;
  suppressAddress?: string;
}

/** SMTP replies 5yz are permanent, 4yz and lost connections temporary (RFC 5321 §4.2.1). */
export function isPermanentFailure(error: unknown): boolean {
  const code = (error as { responseCode?: unknown })?.responseCode;
  return typeof code === 'number' && code >= 500 && code < 600;
}

export class MailSender {
  private readonly batchSize: number;
  private readonly leaseMs: number;
  private readonly maxAttempts: number;
  private readonly retryBaseMs: number;
  private readonly clock: () => Date;
  private readonly fromParts: ReturnType<typeof parseFrom>;
  private readonly contentCache = new Map<number, Promise<GoLiveContent>>();

  constructor(private readonly options: MailSenderOptions) {
    this.batchSize = options.batchSize ?? 100;
    this.leaseMs = options.leaseMs ?? 120_000;
    this.maxAttempts = options.maxAttempts ?? 8;
    this.retryBaseMs = options.retryBaseMs ?? 30_000;
    this.clock = options.clock ?? (() => new Date());
    this.fromParts = parseFrom(options.from);
  }

  get enabled(): boolean {
    return this.options.transport !== null;
  }

  /** Claims due rows (queued, deferred whose time has come, or sending whose lease ran out) for this sender. */
  private async claim(now: Date): Promise<OutboxEntity[]> {
    const ids = await this.options.dataSource.transaction(async (manager) => {
      const found: { id: string }[] = await manager.query(
        `SELECT id FROM mail_outbox
          WHERE (state IN ('queued', 'deferred') AND next_attempt_at <= ?)
             OR (state = 'sending' AND lease_until < ?)
          ORDER BY id LIMIT ? FOR UPDATE SKIP LOCKED`,
        [now, now, this.batchSize],
      );
      if (found.length === 0) return [];
      const claimed = found.map((r) => String(r.id));
      await manager.query(
        `UPDATE mail_outbox SET state = 'sending', lease_until = ?, attempts = attempts + 1 WHERE id IN (?)`,
        [new Date(now.getTime() + this.leaseMs), claimed],
      );
      return claimed;
    });
    if (ids.length === 0) return [];
    return this.options.dataSource.getRepository(OutboxEntity).find({ where: { id: In(ids) }, order: { id: 'ASC' } });
  }

  /** One batch: claim, send, record. */
  async sendBatch(): Promise<BatchResult> {
    return this.deliver(await this.prepare());
  }

  /**
   * Sends batches until nothing is due (or `shouldStop` says so); returns the totals. The next batch is claimed and
   * read while the current one is on the wire, so the transport does not wait for the database between batches.
   */
  async drain(
    shouldStop: () => boolean = () => false,
    onBatch?: (batch: BatchResult) => void | Promise<void>,
  ): Promise<BatchResult> {
    const total: BatchResult = { claimed: 0, sent: 0, deferred: 0, failed: 0, suppressed: 0 };
    if (!this.options.transport) return total;
    let next: Promise<PreparedBatch> | null = shouldStop() ? null : this.prepare();
    while (next) {
      const current = await next;
      if (current.rows.length === 0) break;
      next = shouldStop() ? null : this.prepare();
      // A failure reading the next batch must not leave it unhandled while this one is sent.
      next?.catch(() => {});
      const batch = await this.deliver(current);
      for (const key of Object.keys(total) as (keyof BatchResult)[]) total[key] += batch[key];
      await onBatch?.(batch);
      if (next && shouldStop()) {
        // Claimed but not sent: hand the rows back at once instead of after their lease.
        await this.release((await next).rows);
        next = null;
      }
    }
    return total;
  }

  /** Claims due rows and reads what sending them needs. */
  private async prepare(): Promise<PreparedBatch> {
    const now = this.clock();
    const rows = this.options.transport ? await this.claim(now) : [];
    if (rows.length === 0) return { now, rows: [], plans: [] };

    const manager = this.options.dataSource.manager;
    const subscriberIds = [...new Set(rows.map((r) => r.subscriberId).filter((id): id is number => id !== null))];
    const userIds = [...new Set(rows.map((r) => r.userId).filter((id): id is number => id !== null))];
    const subscribers = new Map(
      (subscriberIds.length ? await manager.getRepository(SubscriberEntity).findBy({ id: In(subscriberIds) }) : []).map(
        (s) => [s.id, s],
      ),
    );
    const users = new Map(
      (userIds.length ? await manager.getRepository(UserEntity).findBy({ id: In(userIds) }) : []).map((u) => [u.id, u]),
    );
    const optOuts = new Set(
      (userIds.length ? await manager.getRepository(MailOptOutEntity).findBy({ userId: In(userIds) }) : []).map(
        (o) => `${o.userId}:${o.kind}`,
      ),
    );
    const mailings = await mailingsById(manager, [
      ...new Set(rows.map((r) => r.mailingId).filter((id): id is number => id !== null)),
    ]);
    const suppressedHashes = await this.suppressedHashes(
      rows.map((row) => this.addressOf(row, subscribers, users)).filter((a): a is string => a !== null),
    );

    const plans = await Promise.all(
      rows.map(async (row): Promise<PlannedRow> => {
        const address = this.addressOf(row, subscribers, users);
        const subscriber = row.subscriberId !== null ? subscribers.get(row.subscriberId) : undefined;
        const user = row.userId !== null ? users.get(row.userId) : undefined;
        const allowed =
          address !== null &&
          !suppressedHashes.has(await this.options.secret.addressHash(address)) &&
          (subscriberMailings.has(row.kind)
            ? subscriber?.status === 'confirmed'
            : row.kind === 'confirm'
              ? subscriber?.status === 'pending'
              : row.userId !== null
                ? Boolean(user?.active) && !optOuts.has(`${row.userId}:${row.kind}`)
                : true);
        return { row, address: allowed ? address : null, subscriber };
      }),
    );
    return { now, rows, plans, mailings };
  }

  /** Sends a prepared batch and records each row's outcome. */
  private async deliver(batch: PreparedBatch): Promise<BatchResult> {
    const result: BatchResult = { claimed: batch.rows.length, sent: 0, deferred: 0, failed: 0, suppressed: 0 };
    if (batch.rows.length === 0) return result;
    const mailings = batch.mailings ?? new Map<number, MailingEntity>();
    const outcomes = await Promise.all(
      batch.plans.map(async ({ row, address, subscriber }): Promise<Outcome> => {
        if (!address) return { row, state: 'suppressed' };
        try {
          const message = await this.compose(row, address, subscriber, mailings);
          await (this.options.transport as Transporter).sendMail(message);
          return { row, state: 'sent' };
        } catch (error) {
          const text = oneLine((error as Error).message ?? String(error), 480);
          if (isPermanentFailure(error)) return { row, state: 'failed', error: text, suppressAddress: address };
          return { row, state: row.attempts >= this.maxAttempts ? 'failed' : 'deferred', error: text };
        }
      }),
    );
    await this.record(outcomes, batch.now);
    for (const outcome of outcomes) result[outcome.state] += 1;
    return result;
  }

  /** Puts claimed rows back in the queue untouched (a stopping sender's batch it will not send). */
  private async release(rows: OutboxEntity[]) {
    if (rows.length === 0) return;
    await this.options.dataSource.query(
      `UPDATE mail_outbox SET state = IF(attempts > 1, 'deferred', 'queued'), lease_until = NULL,
              attempts = attempts - 1
        WHERE id IN (?) AND state = 'sending'`,
      [rows.map((r) => r.id)],
    );
  }

  private addressOf(
    row: OutboxEntity,
    subscribers: Map<number, SubscriberEntity>,
    users: Map<number, UserEntity>,
  ): string | null {
    if (row.recipient) return row.recipient;
    if (row.subscriberId !== null) return subscribers.get(row.subscriberId)?.email ?? null;
    if (row.userId !== null) return users.get(row.userId)?.email ?? null;
    return null;
  }

  private async suppressedHashes(addresses: string[]): Promise<Set<string>> {
    if (addresses.length === 0) return new Set();
    const hashes = await Promise.all(addresses.map((a) => this.options.secret.addressHash(a)));
    const found: { address_hash: string }[] = await this.options.dataSource.query(
      'SELECT address_hash FROM mail_suppressions WHERE address_hash IN (?)',
      [hashes],
    );
    return new Set(found.map((r) => r.address_hash));
  }

  /** A mailing's content, read once per sender: every recipient of a mailing gets the same text. */
  private content(mailing: MailingEntity): Promise<GoLiveContent> {
    let cached = this.contentCache.get(mailing.id);
    if (!cached) {
      cached = loadMailingContent(this.options.dataSource.manager, mailing, this.options.content);
      cached.catch(() => this.contentCache.delete(mailing.id));
      if (this.contentCache.size > 50) this.contentCache.clear();
      this.contentCache.set(mailing.id, cached);
    }
    return cached;
  }

  private async compose(
    row: OutboxEntity,
    address: string,
    subscriber: SubscriberEntity | undefined,
    mailings: Map<number, MailingEntity>,
  ): Promise<SendMailOptions> {
    const { domain, name, address: fromAddress } = this.fromParts;
    const keyHash = createHash('sha256').update(row.idempotencyKey).digest('hex').slice(0, 12);
    const base: SendMailOptions = {
      from: { name: name || 'Benchwire', address: fromAddress },
      to: address,
      messageId: `<outbox-${row.id}.${keyHash}@${domain}>`,
      date: this.clock(),
    };
    const mailing = row.mailingId !== null ? mailings.get(row.mailingId) : undefined;
    const testOf = row.kind === 'test' ? row.payload?.roundupId : undefined;
    if ((mailing && subscriberMailings.has(row.kind)) || testOf !== undefined) {
      const content = mailing
        ? await this.content(mailing)
        : await loadMailingContent(
            this.options.dataSource.manager,
            { roundupId: testOf as number, note: null, kind: 'test' },
            this.options.content,
          );
      // A test shows the links' shape; its token opens nothing.
      const token = subscriber ? await manageToken(this.options.secret, subscriber) : 'test';
      const links = {
        oneClick: `${this.options.siteUrl}/unsubscribe/${token}`,
        mailto: `mailto:unsubscribe@${domain}?subject=${encodeURIComponent(`unsubscribe ${token}`)}`,
        manage: `${this.options.siteUrl}/subscribe/manage/${token}`,
      };
      return {
        ...base,
        ...goLiveMessage(content, links),
        headers: listHeaders(links, `roundups.${domain}`),
      };
    }
    const payload = row.payload ?? { subject: 'Benchwire', text: '' };
    const message = plainMessage(payload.subject, payload.text);
    // A mail that brings its own HTML part (an invitation) built it with every value escaped.
    return { ...base, ...message, ...(payload.html ? { html: payload.html } : {}) };
  }

  private async record(outcomes: Outcome[], now: Date) {
    const ds = this.options.dataSource;
    const sent = outcomes.filter((o) => o.state === 'sent').map((o) => o.row.id);
    if (sent.length) {
      // A confirmation or invitation link is a secret: its text leaves the outbox once the mail is out.
      await ds.query(
        `UPDATE mail_outbox SET state = 'sent', sent_at = ?, lease_until = NULL, last_error = NULL,
                payload = CASE WHEN kind IN ('confirm', 'staff-invite') THEN NULL ELSE payload END
          WHERE id IN (?) AND state = 'sending'`,
        [now, sent],
      );
    }
    const suppressed = outcomes.filter((o) => o.state === 'suppressed').map((o) => o.row.id);
    if (suppressed.length) {
      await ds.query(
        `UPDATE mail_outbox SET state = 'suppressed', lease_until = NULL, payload = NULL WHERE id IN (?) AND state = 'sending'`,
        [suppressed],
      );
    }
    for (const outcome of outcomes.filter((o) => o.state === 'deferred' || o.state === 'failed')) {
      const wait = Math.min(this.retryBaseMs * 2 ** Math.max(0, outcome.row.attempts - 1), 3_600_000);
      await ds.query(
        `UPDATE mail_outbox SET state = ?, last_error = ?, lease_until = NULL, next_attempt_at = ?
          WHERE id = ? AND state = 'sending'`,
        [outcome.state, outcome.error ?? null, new Date(now.getTime() + wait), outcome.row.id],
      );
      if (outcome.suppressAddress) {
        await ds.query(
          "INSERT IGNORE INTO mail_suppressions (address_hash, reason, created_at) VALUES (?, 'bounced', ?)",
          [await this.options.secret.addressHash(outcome.suppressAddress), now],
        );
      }
    }
  }
}
