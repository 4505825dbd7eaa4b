import { Column, Entity } from 'typeorm';
import { IntColumn, OptionalDayColumn, VarcharColumn } from './columns';
import { EditedEntity } from './base-entities';

/** A probe or logger that belongs to a bench, with its last calibration and the interval to the next. */
@Entity({ name: 'bench_instruments' })
export class BenchInstrumentEntity extends EditedEntity {
  @IntColumn('bench_id')
  benchId: number;

  @Column({ type: 'enum', enum: ['probe', 'logger'] })
  kind: 'probe' | 'logger';

  @VarcharColumn(120)
  label: string;

  @VarcharColumn(120, { nullable: true })
  model: string | null;

  @VarcharColumn(80, { nullable: true, name: 'serial_number' })
  serialNumber: string | null;

  @OptionalDayColumn('calibrated_on')
  calibratedOn: string | null;

  @Column({ type: 'tinyint', unsigned: true, name: 'calibration_interval_months' })
  calibrationIntervalMonths: number;
}
