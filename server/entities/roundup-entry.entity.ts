import { Column, Entity, Index } from 'typeorm';
import { IntColumn, OptionalIntColumn } from './columns';
import { RecordedEntity } from './base-entities';

export type EntryKind = 'tested' | 'reference';

/** A catalog product in a roundup: tested here, or a reference entry showing an earlier roundup's results. */
@Entity({ name: 'roundup_entries' })
@Index('uq_roundup_entries_product', ['roundupId', 'productId'], { unique: true })
export class RoundupEntryEntity extends RecordedEntity {
  @IntColumn('roundup_id')
  roundupId: number;

  @IntColumn('product_id')
  productId: number;

  @Column({ type: 'enum', enum: ['tested', 'reference'] })
  kind: EntryKind;

  @OptionalIntColumn('reference_roundup_id')
  referenceRoundupId: number | null;

  @Column({ type: 'smallint', unsigned: true })
  position: number;

  @OptionalIntColumn('added_by')
  addedBy: number | null;
}
