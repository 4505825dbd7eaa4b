import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';
import { IntColumn, InstantColumn, OptionalInstantColumn, DefaultNowColumn, VarcharColumn } from './columns';

export const jobStates = ['pending', 'running', 'done', 'failed', 'cancelled'] as const;
export type JobState = (typeof jobStates)[number];

/** One piece of scheduled work (publish a roundup, send a mail batch…); see server/jobs/job-runner.ts. */
@Entity({ name: 'jobs' })
export class JobEntity {
  @PrimaryGeneratedColumn({ type: 'bigint', unsigned: true })
  id: string;

  @VarcharColumn(64)
  kind: string;

  /** Work with the same key is enqueued once; null for work that may repeat. */
  @VarcharColumn(191, { name: 'unique_key', nullable: true })
  uniqueKey: string | null;

  @Column({ type: 'json' })
  payload: unknown;

  @InstantColumn('run_at')
  runAt: Date;

  @Column({ type: 'enum', enum: jobStates, default: 'pending' })
  state: JobState;

  @Column({ type: 'int', unsigned: true, default: 0 })
  attempts: number;

  @IntColumn('max_attempts', { default: 10 })
  maxAttempts: number;

  @Column({ type: 'text', name: 'last_error', nullable: true })
  lastError: string | null;

  @VarcharColumn(100, { name: 'locked_by', nullable: true })
  lockedBy: string | null;

  @OptionalInstantColumn('locked_at')
  lockedAt: Date | null;

  @OptionalInstantColumn('finished_at')
  finishedAt: Date | null;

  @DefaultNowColumn('created_at')
  createdAt: Date;

  @DefaultNowColumn('updated_at')
  updatedAt: Date;
}
