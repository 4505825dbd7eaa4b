import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';
import { IntColumn, InstantColumn, VarcharColumn } from './columns';

/** A message the local development relay kept (server/mail/local-relay.ts writes these rows directly). */
@Entity({ name: 'relay_messages' })
export class RelayMessageEntity {
  @PrimaryGeneratedColumn({ type: 'bigint', unsigned: true })
  id: string;

  @VarcharColumn(255, { name: 'message_id', nullable: true })
  messageId: string | null;

  @VarcharColumn(320, { name: 'mail_from' })
  mailFrom: string;

  /** The first envelope recipient (Benchwire sends each message to one). */
  @VarcharColumn(320)
  recipient: string;

  /** Every envelope recipient, as a JSON array. */
  @Column({ type: 'text' })
  recipients: string;

  @VarcharColumn(998)
  subject: string;

  @IntColumn('size_bytes')
  sizeBytes: number;

  @InstantColumn('received_at')
  receivedAt: Date;

  @Column({ type: 'longblob', select: false })
  raw: Buffer;
}
