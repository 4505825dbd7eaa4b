import { Column, Entity, PrimaryColumn } from 'typeorm';
import { OptionalIntColumn, InstantColumn, VarcharColumn } from './columns';

/** When a scheduled roundup goes live: the UTC instant, and the local date, time and zone the editor entered. */
@Entity({ name: 'roundup_schedules' })
export class RoundupScheduleEntity {
  @PrimaryColumn({ type: 'int', unsigned: true, name: 'roundup_id' })
  roundupId: number;

  @InstantColumn('publish_at')
  publishAt: Date;

  @Column({ type: 'date', name: 'local_date' })
  localDate: string;

  @VarcharColumn(8, { name: 'local_time' })
  localTime: string;

  @VarcharColumn(64, { name: 'time_zone' })
  timeZone: string;

  @OptionalIntColumn('scheduled_by')
  scheduledBy: number | null;

  @InstantColumn('updated_at')
  updatedAt: Date;
}
