import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';

/** A message the local development relay kept (server/mail/local-relay.ts writes these rows directly). */
@Entity({ name: 'relay_messages' })
export class RelayMessageEntity {
  @PrimaryGeneratedColumn({ type: 'bigint', unsigned: true })
  id: string;

  @Column({ type: 'varchar', length: 255, name: 'message_id', nullable: true })
  messageId: string | null;

  @Column({ type: 'varchar', length: 320, name: 'mail_from' })
  mailFrom: string;

  /** The first envelope recipient (Benchwire sends each message to one). */
  @Column({ type: 'varchar', length: 320 })
  recipient: string;

  /** Every envelope recipient, as a JSON array. */
  @Column({ type: 'text' })
  recipients: string;

  @Column({ type: 'varchar', length: 998 })
  subject: string;

  @Column({ type: 'int', unsigned: true, name: 'size_bytes' })
  sizeBytes: number;

  @Column({ type: 'datetime', precision: 3, name: 'received_at' })
  receivedAt: Date;

  @Column({ type: 'longblob', select: false })
  raw: Buffer;
}
