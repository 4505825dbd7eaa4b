import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';

/** A comment on a write-up section: a thread's opening comment (no parent) or a reply to one. Threads resolve. */
@Entity({ name: 'write_up_comments' })
@Index('ix_write_up_comments_section', ['sectionId', 'parentId', 'id'])
export class WriteUpCommentEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id: number;

  @Column({ type: 'int', unsigned: true, name: 'section_id' })
  sectionId: number;

  @Column({ type: 'int', unsigned: true, name: 'parent_id', nullable: true })
  parentId: number | null;

  @Column({ type: 'int', unsigned: true, name: 'author_id' })
  authorId: number;

  @Column({ type: 'text' })
  body: string;

  @Column({ type: 'datetime', precision: 3, name: 'resolved_at', nullable: true })
  resolvedAt: Date | null;

  @Column({ type: 'int', unsigned: true, name: 'resolved_by', nullable: true })
  resolvedBy: number | null;

  @CreateDateColumn({ type: 'datetime', precision: 3, name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'datetime', precision: 3, name: 'updated_at' })
  updatedAt: Date;
}
