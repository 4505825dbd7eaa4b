import { Column, CreateDateColumn, Entity, PrimaryColumn } from 'typeorm';

/** A person's private calendar feed. The secret token is in the feed's address only; this keeps its SHA-256. */
@Entity({ name: 'calendar_feeds' })
export class CalendarFeedEntity {
  @PrimaryColumn({ type: 'int', unsigned: true, name: 'user_id' })
  userId: number;

  @Column({ type: 'char', length: 64, name: 'token_hash', unique: true })
  tokenHash: string;

  @CreateDateColumn({ type: 'datetime', precision: 3, name: 'created_at' })
  createdAt: Date;
}
