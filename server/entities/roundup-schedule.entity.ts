import { Column, Entity, PrimaryColumn } from 'typeorm';

/** When a scheduled roundup goes live: the UTC instant, and the local date, time and zone the editor entered. */
@Entity({ name: 'roundup_schedules' })
export class RoundupScheduleEntity {
  @PrimaryColumn({ type: 'int', unsigned: true, name: 'roundup_id' })
  roundupId: number;

  @Column({ type: 'datetime', precision: 3, name: 'publish_at' })
  publishAt: Date;

  @Column({ type: 'date', name: 'local_date' })
  localDate: string;

  @Column({ type: 'varchar', length: 8, name: 'local_time' })
  localTime: string;

  @Column({ type: 'varchar', length: 64, name: 'time_zone' })
  timeZone: string;

  @Column({ type: 'int', unsigned: true, name: 'scheduled_by', nullable: true })
  scheduledBy: number | null;

  @Column({ type: 'datetime', precision: 3, name: 'updated_at' })
  updatedAt: Date;
}
