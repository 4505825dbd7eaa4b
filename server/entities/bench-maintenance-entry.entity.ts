import { Entity } from 'typeorm';
import { IntColumn, OptionalIntColumn, DayColumn, VarcharColumn } from './columns';
import { RecordedEntity } from './base-entities';

/** One line of a bench's maintenance log: what was done, on which day, recorded by whom. */
@Entity({ name: 'bench_maintenance_entries' })
export class BenchMaintenanceEntryEntity extends RecordedEntity {
  @IntColumn('bench_id')
  benchId: number;

  @DayColumn('done_on')
  doneOn: string;

  @VarcharColumn(500)
  description: string;

  @OptionalIntColumn('recorded_by')
  recordedBy: number | null;
}
