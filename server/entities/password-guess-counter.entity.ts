import { Column, Entity, Index, PrimaryColumn } from 'typeorm';

/**
 * Wrong passwords counted per account (e-mail) or per client address. The key is a SHA-256 of the kind and
 * the value, so the table holds no addresses or e-mails that were merely typed at the sign-in form.
 */
@Entity({ name: 'password_guess_counters' })
export class PasswordGuessCounterEntity {
  @PrimaryColumn({ type: 'char', length: 64, name: 'counter_key' })
  counterKey: string;

  @Column({ type: 'enum', enum: ['account', 'address'] })
  kind: 'account' | 'address';

  @Column({ type: 'int', unsigned: true })
  failures: number;

  @Column({ type: 'datetime', precision: 3, name: 'window_started_at' })
  windowStartedAt: Date;

  @Column({ type: 'datetime', precision: 3, name: 'locked_until', nullable: true })
  lockedUntil: Date | null;

  @Index('ix_password_guess_counters_updated')
  @Column({ type: 'datetime', precision: 3, name: 'updated_at' })
  updatedAt: Date;
}
