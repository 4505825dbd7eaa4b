import { Column, Entity, Index } from 'typeorm';
import { EditedEntity } from './base-entities';
import { IntColumn, OptionalIntColumn, InstantColumn, VarcharColumn } from './columns';
import {
  sectionKinds,
  sectionReviewStates,
  type SectionKind,
  type SectionReviewState,
} from '../../shared/domain/editorial/section-states';
import type { WriteUpDocument } from '../../shared/schemas/write-up-document';

/**
 * One section of a roundup's write-up. `version` goes up by one on every saved change: a save names the version it
 * started from and is refused when another save came first.
 */
@Entity({ name: 'write_up_sections' })
@Index('uq_write_up_sections_key', ['roundupId', 'sectionKey'], { unique: true })
@Index('ix_write_up_sections_roundup', ['roundupId', 'position'])
export class WriteUpSectionEntity extends EditedEntity {
  @IntColumn('roundup_id')
  roundupId: number;

  @Column({ type: 'enum', enum: sectionKinds })
  kind: SectionKind;

  @OptionalIntColumn('roundup_entry_id')
  entryId: number | null;

  /** `introduction`, `methodology`, `conclusion` or `entry-<id>`: one section per key and roundup. */
  @VarcharColumn(40, { name: 'section_key' })
  sectionKey: string;

  @Column({ type: 'smallint', unsigned: true })
  position: number;

  @VarcharColumn(200)
  title: string;

  @Column({ type: 'json' })
  content: WriteUpDocument;

  @Column({ type: 'int', unsigned: true, default: 1 })
  version: number;

  @Column({ type: 'enum', enum: sectionReviewStates, name: 'review_state', default: 'drafting' })
  reviewState: SectionReviewState;

  @InstantColumn('review_state_changed_at')
  reviewStateChangedAt: Date;

  @OptionalIntColumn('review_state_changed_by')
  reviewStateChangedBy: number | null;

  @OptionalIntColumn('updated_by')
  updatedBy: number | null;
}
