// The subscriber and outbox tables (migration 1765800002000). One file: they are read and written together.
import { Column, Entity, PrimaryColumn, PrimaryGeneratedColumn } from 'typeorm';
import {
  IntColumn,
  OptionalIntColumn,
  InstantColumn,
  OptionalInstantColumn,
  DefaultNowColumn,
  VarcharColumn,
} from './columns';
import { KeyedByPair } from './base-entities';

export const subscriberStatuses = ['pending', 'confirmed', 'unsubscribed'] as const;
export type SubscriberStatus = (typeof subscriberStatuses)[number];
export const outboxStates = ['queued', 'sending', 'sent', 'deferred', 'failed', 'suppressed'] as const;
export type OutboxState = (typeof outboxStates)[number];
export const suppressionReasons = ['erased', 'bounced', 'complained'] as const;
export type SuppressionReason = (typeof suppressionReasons)[number];
export const mailingKinds = ['go-live', 'update', 'correction'] as const;
export type MailingKind = (typeof mailingKinds)[number];

/** A secret the app made once and keeps (e.g. the key of subscribers' self-service links). */
@Entity({ name: 'app_secrets' })
export class AppSecretEntity {
  @PrimaryColumn({ type: 'varchar', length: 64 })
  name: string;

  @VarcharColumn(128)
  value: string;

  @InstantColumn('created_at')
  createdAt: Date;
}

/** A subject readers can subscribe to; a roundup belongs to it when its product class and platform match. */
@Entity({ name: 'mail_categories' })
export class MailCategoryEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id: number;

  @VarcharColumn(80)
  name: string;

  @VarcharColumn(300, { nullable: true })
  description: string | null;

  /** A roundup's category (product class); null matches any. */
  @VarcharColumn(32, { name: 'match_product_class', nullable: true })
  matchProductClass: string | null;

  /** A roundup's platform; null matches any. */
  @VarcharColumn(80, { name: 'match_platform', nullable: true })
  matchPlatform: string | null;

  @Column({ type: 'smallint', unsigned: true, default: 0 })
  position: number;

  @DefaultNowColumn('created_at')
  createdAt: Date;
}

@Entity({ name: 'subscribers' })
export class SubscriberEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id: number;

  @VarcharColumn(254)
  email: string;

  @Column({ type: 'enum', enum: subscriberStatuses, default: 'pending' })
  status: SubscriberStatus;

  /** SHA-256 of the open confirmation link's token; null once used. */
  @Column({ type: 'char', length: 64, name: 'confirm_token_hash', nullable: true })
  confirmTokenHash: string | null;

  @OptionalInstantColumn('confirm_expires_at')
  confirmExpiresAt: Date | null;

  /** Part of every signed self-service link; raising it ends all earlier links. */
  @IntColumn('link_version', { default: 1 })
  linkVersion: number;

  @DefaultNowColumn('created_at')
  createdAt: Date;

  @OptionalInstantColumn('confirmed_at')
  confirmedAt: Date | null;

  @OptionalInstantColumn('unsubscribed_at')
  unsubscribedAt: Date | null;

  @DefaultNowColumn('updated_at')
  updatedAt: Date;
}

@Entity({ name: 'subscriber_categories' })
export class SubscriberCategoryEntity extends KeyedByPair(
  ['subscriberId', 'subscriber_id'],
  ['categoryId', 'category_id'],
) {}

/** An address never to mail again, kept only as a salted hash. */
@Entity({ name: 'mail_suppressions' })
export class MailSuppressionEntity {
  @PrimaryColumn({ type: 'char', length: 64, name: 'address_hash' })
  addressHash: string;

  @Column({ type: 'enum', enum: suppressionReasons })
  reason: SuppressionReason;

  @DefaultNowColumn('created_at')
  createdAt: Date;
}

/** One mailing to subscribers about a roundup: when it went live, or an update or correction an editor chose to send. */
@Entity({ name: 'mailings' })
export class MailingEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id: number;

  @IntColumn('roundup_id')
  roundupId: number;

  @Column({ type: 'enum', enum: mailingKinds })
  kind: MailingKind;

  @VarcharColumn(2000, { nullable: true })
  note: string | null;

  @OptionalIntColumn('created_by')
  createdBy: number | null;

  @DefaultNowColumn('created_at')
  createdAt: Date;
}

/** What a transactional or staff mail says, fixed when it is queued. */
export interface OutboxPayload {
  subject: string;
  text: string;
  html?: string;
  /** A test of a roundup's mailing: the roundup whose go-live mail it previews. */
  roundupId?: number;
}

/** One mail to one recipient. The idempotency key makes a second row for the same purpose impossible. */
@Entity({ name: 'mail_outbox' })
export class OutboxEntity {
  @PrimaryGeneratedColumn({ type: 'bigint', unsigned: true })
  id: string;

  @VarcharColumn(191, { name: 'idempotency_key' })
  idempotencyKey: string;

  @VarcharColumn(32)
  kind: string;

  @OptionalIntColumn('mailing_id')
  mailingId: number | null;

  @OptionalIntColumn('subscriber_id')
  subscriberId: number | null;

  @OptionalIntColumn('user_id')
  userId: number | null;

  /** Fixed for staff and test mail; subscribers' addresses are read at send time (an erased one is gone). */
  @VarcharColumn(254, { nullable: true })
  recipient: string | null;

  @Column({ type: 'enum', enum: outboxStates, default: 'queued' })
  state: OutboxState;

  @Column({ type: 'smallint', unsigned: true, default: 0 })
  attempts: number;

  @InstantColumn('next_attempt_at')
  nextAttemptAt: Date;

  @OptionalInstantColumn('lease_until')
  leaseUntil: Date | null;

  @Column({ type: 'json', nullable: true })
  payload: OutboxPayload | null;

  @VarcharColumn(500, { name: 'last_error', nullable: true })
  lastError: string | null;

  @DefaultNowColumn('created_at')
  createdAt: Date;

  @OptionalInstantColumn('sent_at')
  sentAt: Date | null;
}

/** A kind of staff mail a person turned off in Account. */
@Entity({ name: 'mail_opt_outs' })
export class MailOptOutEntity {
  @PrimaryColumn({ type: 'int', unsigned: true, name: 'user_id' })
  userId: number;

  @PrimaryColumn({ type: 'varchar', length: 32 })
  kind: string;
}
