import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';
import { OptionalIntColumn, VarcharColumn } from './columns';

/** Who did what to which record, and when. Written in the same transaction as the change. */
@Entity({ name: 'audit_entries' })
@Index(['subjectType', 'subjectId'])
export class AuditEntryEntity {
  @PrimaryGeneratedColumn({ type: 'bigint', unsigned: true })
  id: string;

  @OptionalIntColumn('actor_id')
  actorId: number | null;

  @VarcharColumn(64)
  action: string;

  @VarcharColumn(64, { name: 'subject_type' })
  subjectType: string;

  @VarcharColumn(64, { name: 'subject_id', nullable: true })
  subjectId: string | null;

  @Column({ type: 'json', nullable: true })
  details: Record<string, unknown> | null;

  @Index()
  @CreateDateColumn({ type: 'datetime', precision: 3, name: 'created_at' })
  createdAt: Date;
}
