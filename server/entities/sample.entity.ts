import { Column, Entity, Index } from 'typeorm';
import { IntColumn, OptionalIntColumn, OptionalDayColumn, VarcharColumn } from './columns';
import { EditedEntity } from './base-entities';
import type { SampleSource, SampleStatus } from '../../shared/schemas/samples';
import { sampleSources, sampleStatuses } from '../../shared/schemas/samples';

/** The physical sample behind a tested roundup entry: where it came from and where it is. */
@Entity({ name: 'samples' })
@Index('ix_samples_loans', ['source', 'status', 'returnBy'])
export class SampleEntity extends EditedEntity {
  @IntColumn('roundup_entry_id', { unique: true })
  entryId: number;

  @Column({ type: 'enum', enum: sampleSources, nullable: true })
  source: SampleSource | null;

  @VarcharColumn(120, { name: 'order_reference', nullable: true })
  orderReference: string | null;

  /** Integer minor units of `costCurrency`. */
  @OptionalIntColumn('cost_minor')
  costMinor: number | null;

  @Column({ type: 'char', length: 3, name: 'cost_currency', nullable: true })
  costCurrency: string | null;

  @VarcharColumn(200, { name: 'vendor_contact', nullable: true })
  vendorContact: string | null;

  @OptionalDayColumn('return_by')
  returnBy: string | null;

  @OptionalDayColumn('received_on')
  receivedOn: string | null;

  @OptionalDayColumn('returned_on')
  returnedOn: string | null;

  @VarcharColumn(80, { name: 'serial_number', nullable: true })
  serialNumber: string | null;

  @VarcharColumn(1000, { name: 'condition_notes', nullable: true })
  conditionNotes: string | null;

  @VarcharColumn(80, { name: 'firmware_on_arrival', nullable: true })
  firmwareOnArrival: string | null;

  @Column({ type: 'enum', enum: sampleStatuses, default: 'ordered' })
  status: SampleStatus;
}
