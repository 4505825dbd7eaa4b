import { Column, Entity } from 'typeorm';
import { RecordedEntity } from './base-entities';

/** One line of a bench's maintenance log: what was done, on which day, recorded by whom. */
@Entity({ name: 'bench_maintenance_entries' })
export class BenchMaintenanceEntryEntity extends RecordedEntity {
  @Column({ type: 'int', unsigned: true, name: 'bench_id' })
  benchId: number;

  @Column({ type: 'date', name: 'done_on', utc: true })
  doneOn: string;

  @Column({ type: 'varchar', length: 500 })
  description: string;

  @Column({ type: 'int', unsigned: true, nullable: true, name: 'recorded_by' })
  recordedBy: number | null;
}
