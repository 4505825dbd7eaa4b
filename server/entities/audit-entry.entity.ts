import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/** Who did what to which record, and when. Written in the same transaction as the change. */
@Entity({ name: 'audit_entries' })
@Index(['subjectType', 'subjectId'])
export class AuditEntryEntity {
  @PrimaryGeneratedColumn({ type: 'bigint', unsigned: true })
  id: string;

  @Column({ type: 'int', unsigned: true, name: 'actor_id', nullable: true })
  actorId: number | null;

  @Column({ type: 'varchar', length: 64 })
  action: string;

  @Column({ type: 'varchar', length: 64, name: 'subject_type' })
  subjectType: string;

  @Column({ type: 'varchar', length: 64, name: 'subject_id', nullable: true })
  subjectId: string | null;

  @Column({ type: 'json', nullable: true })
  details: Record<string, unknown> | null;

  @Index()
  @CreateDateColumn({ type: 'datetime', precision: 3, name: 'created_at' })
  createdAt: Date;
}
