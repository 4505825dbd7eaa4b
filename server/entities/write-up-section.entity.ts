import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
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
export class WriteUpSectionEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id: number;

  @Column({ type: 'int', unsigned: true, name: 'roundup_id' })
  roundupId: number;

  @Column({ type: 'enum', enum: sectionKinds })
  kind: SectionKind;

  @Column({ type: 'int', unsigned: true, name: 'roundup_entry_id', nullable: true })
  entryId: number | null;

  /** `introduction`, `methodology`, `conclusion` or `entry-<id>`: one section per key and roundup. */
  @Column({ type: 'varchar', length: 40, name: 'section_key' })
  sectionKey: string;

  @Column({ type: 'smallint', unsigned: true })
  position: number;

  @Column({ type: 'varchar', length: 200 })
  title: string;

  @Column({ type: 'json' })
  content: WriteUpDocument;

  @Column({ type: 'int', unsigned: true, default: 1 })
  version: number;

  @Column({ type: 'enum', enum: sectionReviewStates, name: 'review_state', default: 'drafting' })
  reviewState: SectionReviewState;

  @Column({ type: 'datetime', precision: 3, name: 'review_state_changed_at' })
  reviewStateChangedAt: Date;

  @Column({ type: 'int', unsigned: true, name: 'review_state_changed_by', nullable: true })
  reviewStateChangedBy: number | null;

  @Column({ type: 'int', unsigned: true, name: 'updated_by', nullable: true })
  updatedBy: number | null;

  @CreateDateColumn({ type: 'datetime', precision: 3, name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'datetime', precision: 3, name: 'updated_at' })
  updatedAt: Date;
}
