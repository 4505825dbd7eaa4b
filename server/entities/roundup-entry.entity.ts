import { Column, Entity, Index } from 'typeorm';
import { RecordedEntity } from './base-entities';

export type EntryKind = 'tested' | 'reference';

/** A catalog product in a roundup: tested here, or a reference entry showing an earlier roundup's results. */
@Entity({ name: 'roundup_entries' })
@Index('uq_roundup_entries_product', ['roundupId', 'productId'], { unique: true })
export class RoundupEntryEntity extends RecordedEntity {
  @Column({ type: 'int', unsigned: true, name: 'roundup_id' })
  roundupId: number;

  @Column({ type: 'int', unsigned: true, name: 'product_id' })
  productId: number;

  @Column({ type: 'enum', enum: ['tested', 'reference'] })
  kind: EntryKind;

  @Column({ type: 'int', unsigned: true, name: 'reference_roundup_id', nullable: true })
  referenceRoundupId: number | null;

  @Column({ type: 'smallint', unsigned: true })
  position: number;

  @Column({ type: 'int', unsigned: true, name: 'added_by', nullable: true })
  addedBy: number | null;
}
