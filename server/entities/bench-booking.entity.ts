import { Column, Entity, Index } from 'typeorm';
import { RecordedEntity } from './base-entities';

/** A tester's slot [startsAt, endsAt) on one bench. No two bookings on a bench overlap. */
@Entity({ name: 'bench_bookings' })
@Index('ix_bench_bookings_calendar', ['benchId', 'startsAt', 'endsAt'])
@Index('ix_bench_bookings_tester', ['testerId', 'startsAt'])
export class BenchBookingEntity extends RecordedEntity {
  @Column({ type: 'int', unsigned: true, name: 'bench_id' })
  benchId: number;

  @Column({ type: 'int', unsigned: true, name: 'tester_id' })
  testerId: number;

  @Column({ type: 'datetime', precision: 3, name: 'starts_at' })
  startsAt: Date;

  @Column({ type: 'datetime', precision: 3, name: 'ends_at' })
  endsAt: Date;

  @Column({ type: 'varchar', length: 300, nullable: true })
  note: string | null;

  /** Why it was booked although the bench's set-up differs from a roundup's bench profile. */
  @Column({ type: 'varchar', length: 300, nullable: true, name: 'override_reason' })
  overrideReason: string | null;
}
