import { Column, Entity, Index } from 'typeorm';
import { EditedEntity } from './base-entities';
import { IntColumn, OptionalIntColumn, VarcharColumn } from './columns';
import type { WriteUpDocument } from '../../shared/schemas/write-up-document';

export const revisionKinds = ['prefill', 'save', 'restore', 'refused-copy'] as const;
export type RevisionKind = (typeof revisionKinds)[number];

/**
 * A saved state of a section. Saves by one author close together share one revision (it keeps the latest text);
 * a save refused for coming from an older version is kept as a `refused-copy`, so nothing typed is lost.
 */
@Entity({ name: 'write_up_revisions' })
@Index('ix_write_up_revisions_section', ['sectionId', 'id'])
export class WriteUpRevisionEntity extends EditedEntity {
  @IntColumn('section_id')
  sectionId: number;

  @Column({ type: 'enum', enum: revisionKinds })
  kind: RevisionKind;

  /** The section version this revision is; null for a refused copy, which never became a version. */
  @Column({ type: 'int', unsigned: true, nullable: true })
  version: number | null;

  @OptionalIntColumn('based_on_version')
  basedOnVersion: number | null;

  @OptionalIntColumn('restored_from_id')
  restoredFromId: number | null;

  @VarcharColumn(200)
  title: string;

  @Column({ type: 'json' })
  content: WriteUpDocument;

  @OptionalIntColumn('author_id')
  authorId: number | null;
}
