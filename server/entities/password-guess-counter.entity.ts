import { Column, Entity, Index, PrimaryColumn } from 'typeorm';
import { InstantColumn, OptionalInstantColumn } from './columns';

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

  @InstantColumn('window_started_at')
  windowStartedAt: Date;

  @OptionalInstantColumn('locked_until')
  lockedUntil: Date | null;

  @Index('ix_password_guess_counters_updated')
  @InstantColumn('updated_at')
  updatedAt: Date;
}
