import { Column, Entity, Index } from 'typeorm';
import { EditedEntity } from './base-entities';
import { IntColumn, OptionalIntColumn, OptionalInstantColumn } from './columns';

/** A comment on a write-up section: a thread's opening comment (no parent) or a reply to one. Threads resolve. */
@Entity({ name: 'write_up_comments' })
@Index('ix_write_up_comments_section', ['sectionId', 'parentId', 'id'])
export class WriteUpCommentEntity extends EditedEntity {
  @IntColumn('section_id')
  sectionId: number;

  @OptionalIntColumn('parent_id')
  parentId: number | null;

  @IntColumn('author_id')
  authorId: number;

  @Column({ type: 'text' })
  body: string;

  @OptionalInstantColumn('resolved_at')
  resolvedAt: Date | null;

  @OptionalIntColumn('resolved_by')
  resolvedBy: number | null;
}
