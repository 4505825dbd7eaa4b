import { Column, Entity } from 'typeorm';
import { EditedEntity } from './base-entities';

/** A probe or logger that belongs to a bench, with its last calibration and the interval to the next. */
@Entity({ name: 'bench_instruments' })
export class BenchInstrumentEntity extends EditedEntity {
  @Column({ type: 'int', unsigned: true, name: 'bench_id' })
  benchId: number;

  @Column({ type: 'enum', enum: ['probe', 'logger'] })
  kind: 'probe' | 'logger';

  @Column({ type: 'varchar', length: 120 })
  label: string;

  @Column({ type: 'varchar', length: 120, nullable: true })
  model: string | null;

  @Column({ type: 'varchar', length: 80, nullable: true, name: 'serial_number' })
  serialNumber: string | null;

  @Column({ type: 'date', nullable: true, name: 'calibrated_on', utc: true })
  calibratedOn: string | null;

  @Column({ type: 'tinyint', unsigned: true, name: 'calibration_interval_months' })
  calibrationIntervalMonths: number;
}
