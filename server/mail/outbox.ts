// Writing to the outbox. Every mail is a row with an idempotency key (unique), so queuing the same purpose twice —
// a publish retried, a reminder job run every few minutes — never makes a second mail. Callers pass their own
// transaction's manager, so the mail is queued exactly when their change commits.
import type { EntityManager } from 'typeorm';
import { MailingEntity, OutboxEntity, type MailingKind, type OutboxPayload } from '../entities/mail.entities';
import { RoundupEntity } from '../entities/roundup.entity';

export interface QueuedMail {
  /** Unique per purpose, e.g. `reminder:loan-due-soon:sample:9:2026-12-06:user:3`. */
  key: string;
  kind: string;
  userId?: number | null;
  subscriberId?: number | null;
  recipient?: string | null;
  payload?: OutboxPayload | null;
  mailingId?: number | null;
  /** Not before this instant (default: now). */
  notBefore?: Date;
}

/** Queues one mail unless a mail with the same key exists; true when this call queued it. */
export async function enqueueMail(manager: EntityManager, mail: QueuedMail): Promise<boolean> {
  const result = await manager
    .createQueryBuilder()
    .insert()
    .into(OutboxEntity)
    .orIgnore()
    .values({
      idempotencyKey: mail.key.slice(0, 191),
      kind: mail.kind,
      userId: mail.userId ?? null,
      subscriberId: mail.subscriberId ?? null,
      recipient: mail.recipient ?? null,
      payload: mail.payload ?? null,
      mailingId: mail.mailingId ?? null,
      state: 'queued',
      nextAttemptAt: mail.notBefore ?? new Date(),
    })
    .updateEntity(false)
    .execute();
  return (result.raw as { affectedRows?: number }).affectedRows === 1;
}

export interface MailingQueued {
  mailingId: number;
  /** Rows this call added (0 when the mailing already existed). */
  queued: number;
}

/**
 * Queues a mailing about a roundup to every confirmed subscriber of a category it belongs to: one outbox row per
 * (mailing, subscriber), in the caller's transaction. A go-live mailing is made once per roundup: calling again
 * returns the first one.
 */
export async function enqueueRoundupMailing(
  manager: EntityManager,
  roundupId: number,
  options: { kind: MailingKind; note?: string | null; actorId?: number | null; now?: Date },
): Promise<MailingQueued> {
  const now = options.now ?? new Date();
  const roundup = await manager.getRepository(RoundupEntity).findOneByOrFail({ id: roundupId });
  const mailings = manager.getRepository(MailingEntity);
  if (options.kind === 'go-live') {
    const existing = await mailings.findOne({
      where: { roundupId, kind: 'go-live' },
      lock: { mode: 'pessimistic_write' },
    });
    if (existing) return { mailingId: existing.id, queued: 0 };
  }
  const mailing = await mailings.save(
    mailings.create({
      roundupId,
      kind: options.kind,
      note: options.note ?? null,
      createdBy: options.actorId ?? null,
      createdAt: now,
    }),
  );
  // One statement for every recipient: a mailing to ten thousand subscribers is one round trip.
  const result: unknown = await manager.query(
    `INSERT IGNORE INTO mail_outbox (idempotency_key, kind, mailing_id, subscriber_id, state, next_attempt_at)
     SELECT CONCAT('mailing:', ?, ':subscriber:', s.id), ?, ?, s.id, 'queued', ?
       FROM subscribers s
      WHERE s.status = 'confirmed'
        AND EXISTS (
          SELECT 1 FROM subscriber_categories sc JOIN mail_categories c ON c.id = sc.category_id
           WHERE sc.subscriber_id = s.id
             AND (c.match_product_class IS NULL OR c.match_product_class = ?)
             AND (c.match_platform IS NULL OR c.match_platform = ?))
      ORDER BY s.id`,
    [mailing.id, options.kind, mailing.id, now, roundup.category, roundup.platform],
  );
  return { mailingId: mailing.id, queued: (result as { affectedRows?: number }).affectedRows ?? 0 };
}

/**
 * The publish transaction's hook: queues the go-live mail of a roundup that has just gone live, once. Call it with
 * the publish transaction's manager so the mail is queued if and only if the publish commits.
 */
export function enqueueGoLiveMailing(manager: EntityManager, roundupId: number): Promise<MailingQueued> {
  return enqueueRoundupMailing(manager, roundupId, { kind: 'go-live' });
}
