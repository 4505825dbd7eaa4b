import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { WriteUpDocument } from '../../shared/schemas/write-up-document';

export const revisionKinds = ['prefill', 'save', 'restore', 'refused-copy'] as const;
export type RevisionKind = (typeof revisionKinds)[number];

/**
 * A saved state of a section. Saves by one author close together share one revision (it keeps the latest text);
 * a save refused for coming from an older version is kept as a `refused-copy`, so nothing typed is lost.
 */
@Entity({ name: 'write_up_revisions' })
@Index('ix_write_up_revisions_section', ['sectionId', 'id'])
export class WriteUpRevisionEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id: number;

  @Column({ type: 'int', unsigned: true, name: 'section_id' })
  sectionId: number;

  @Column({ type: 'enum', enum: revisionKinds })
  kind: RevisionKind;

  /** The section version this revision is; null for a refused copy, which never became a version. */
  @Column({ type: 'int', unsigned: true, nullable: true })
  version: number | null;

  @Column({ type: 'int', unsigned: true, name: 'based_on_version', nullable: true })
  basedOnVersion: number | null;

  @Column({ type: 'int', unsigned: true, name: 'restored_from_id', nullable: true })
  restoredFromId: number | null;

  @Column({ type: 'varchar', length: 200 })
  title: string;

  @Column({ type: 'json' })
  content: WriteUpDocument;

  @Column({ type: 'int', unsigned: true, name: 'author_id', nullable: true })
  authorId: number | null;

  @CreateDateColumn({ type: 'datetime', precision: 3, name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'datetime', precision: 3, name: 'updated_at' })
  updatedAt: Date;
}
