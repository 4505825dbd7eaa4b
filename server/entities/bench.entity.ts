import { Column, Entity } from 'typeorm';
import { OptionalIntColumn, VarcharColumn } from './columns';
import { EditedEntity } from './base-entities';

/** A physical test system with a booking calendar. Its row is the lock that serialises bookings. */
@Entity({ name: 'benches' })
export class BenchEntity extends EditedEntity {
  @VarcharColumn(80, { unique: true })
  name: string;

  @VarcharColumn(120, { nullable: true })
  location: string | null;

  @OptionalIntColumn('bench_profile_id')
  benchProfileId: number | null;

  @VarcharColumn(500, { nullable: true })
  notes: string | null;

  @Column({ type: 'boolean', default: true })
  active: boolean;
}
