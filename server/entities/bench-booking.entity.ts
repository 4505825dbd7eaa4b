import { Entity, Index } from 'typeorm';
import { IntColumn, InstantColumn, VarcharColumn } from './columns';
import { RecordedEntity } from './base-entities';

/** A tester's slot [startsAt, endsAt) on one bench. No two bookings on a bench overlap. */
@Entity({ name: 'bench_bookings' })
@Index('ix_bench_bookings_calendar', ['benchId', 'startsAt', 'endsAt'])
@Index('ix_bench_bookings_tester', ['testerId', 'startsAt'])
export class BenchBookingEntity extends RecordedEntity {
  @IntColumn('bench_id')
  benchId: number;

  @IntColumn('tester_id')
  testerId: number;

  @InstantColumn('starts_at')
  startsAt: Date;

  @InstantColumn('ends_at')
  endsAt: Date;

  @VarcharColumn(300, { nullable: true })
  note: string | null;

  /** Why it was booked although the bench's set-up differs from a roundup's bench profile. */
  @VarcharColumn(300, { nullable: true, name: 'override_reason' })
  overrideReason: string | null;
}
