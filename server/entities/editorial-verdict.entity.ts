import { Column, Entity, Index } from 'typeorm';
import { IntColumn, VarcharColumn } from './columns';
import { EditedEntity } from './base-entities';
import { editorialLabels, type EditorialLabel } from '../../shared/domain/editorial/editorial-labels';

/** The editor's verdict on one tested product of a roundup: label, "best for", price at publication. */
@Entity({ name: 'editorial_verdicts' })
export class EditorialVerdictEntity extends EditedEntity {
  @Index('ix_editorial_verdicts_roundup')
  @IntColumn('roundup_id')
  roundupId: number;

  @Index('uq_editorial_verdicts_entry', { unique: true })
  @IntColumn('roundup_entry_id')
  entryId: number;

  @Column({ type: 'enum', enum: editorialLabels })
  label: EditorialLabel;

  @VarcharColumn(160, { name: 'best_for' })
  bestFor: string;

  /** Integer minor units of `priceCurrency`. */
  @IntColumn('price_minor')
  priceMinor: number;

  @Column({ type: 'char', length: 3, name: 'price_currency' })
  priceCurrency: string;

  /** Why the label stands against the rubric verdicts; required when it contradicts them. */
  @Column({ type: 'text', nullable: true })
  reason: string | null;

  /** The contradictions the reason answered, as they were when the label was set. */
  @Column({ type: 'json', nullable: true })
  contradictions: string[] | null;

  @IntColumn('updated_by')
  updatedBy: number;
}
