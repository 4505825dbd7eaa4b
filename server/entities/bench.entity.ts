import { Column, Entity } from 'typeorm';
import { EditedEntity } from './base-entities';

/** A physical test system with a booking calendar. Its row is the lock that serialises bookings. */
@Entity({ name: 'benches' })
export class BenchEntity extends EditedEntity {
  @Column({ type: 'varchar', length: 80, unique: true })
  name: string;

  @Column({ type: 'varchar', length: 120, nullable: true })
  location: string | null;

  @Column({ type: 'int', unsigned: true, name: 'bench_profile_id', nullable: true })
  benchProfileId: number | null;

  @Column({ type: 'varchar', length: 500, nullable: true })
  notes: string | null;

  @Column({ type: 'boolean', default: true })
  active: boolean;
}
