import { Column, Entity, Index } from 'typeorm';
import { EditedEntity } from './base-entities';
import type { SampleSource, SampleStatus } from '../../shared/schemas/samples';
import { sampleSources, sampleStatuses } from '../../shared/schemas/samples';

/** The physical sample behind a tested roundup entry: where it came from and where it is. */
@Entity({ name: 'samples' })
@Index('ix_samples_loans', ['source', 'status', 'returnBy'])
export class SampleEntity extends EditedEntity {
  @Column({ type: 'int', unsigned: true, name: 'roundup_entry_id', unique: true })
  entryId: number;

  @Column({ type: 'enum', enum: sampleSources, nullable: true })
  source: SampleSource | null;

  @Column({ type: 'varchar', length: 120, name: 'order_reference', nullable: true })
  orderReference: string | null;

  /** Integer minor units of `costCurrency`. */
  @Column({ type: 'int', unsigned: true, name: 'cost_minor', nullable: true })
  costMinor: number | null;

  @Column({ type: 'char', length: 3, name: 'cost_currency', nullable: true })
  costCurrency: string | null;

  @Column({ type: 'varchar', length: 200, name: 'vendor_contact', nullable: true })
  vendorContact: string | null;

  @Column({ type: 'date', name: 'return_by', nullable: true, utc: true })
  returnBy: string | null;

  @Column({ type: 'date', name: 'received_on', nullable: true, utc: true })
  receivedOn: string | null;

  @Column({ type: 'date', name: 'returned_on', nullable: true, utc: true })
  returnedOn: string | null;

  @Column({ type: 'varchar', length: 80, name: 'serial_number', nullable: true })
  serialNumber: string | null;

  @Column({ type: 'varchar', length: 1000, name: 'condition_notes', nullable: true })
  conditionNotes: string | null;

  @Column({ type: 'varchar', length: 80, name: 'firmware_on_arrival', nullable: true })
  firmwareOnArrival: string | null;

  @Column({ type: 'enum', enum: sampleStatuses, default: 'ordered' })
  status: SampleStatus;
}
